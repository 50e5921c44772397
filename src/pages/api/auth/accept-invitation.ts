import type { APIRoute } from 'astro';
import { handle, json, readJson } from '~/lib/server/http';
import { acceptInvitationSchema } from '~/lib/server/auth/new-password';
import { acceptInvitation } from '~/lib/server/invitations';
import { clientIp } from '~/lib/server/request';

export const POST: APIRoute = handle(async (context) => {
  const input = await readJson(context.request, acceptInvitationSchema, 16 * 1024);
  const user = await acceptInvitation(input, context.cookies, clientIp(context));
  return json({ user }, 201);
});
