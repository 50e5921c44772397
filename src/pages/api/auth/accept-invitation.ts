import type { APIRoute } from 'astro';
import { handle, json, readJson } from '~/lib/server/http';
import { acceptInvitationSchema } from '~/lib/server/auth/new-password';
import { acceptInvitation } from '~/lib/server/invitations';
import { clientAddress } from '~/lib/server/client-address';

export const POST: APIRoute = handle(async (context) => {
  const input = await readJson(context.request, acceptInvitationSchema, 16 * 1024);
  const user = await acceptInvitation(input, context.cookies, clientAddress(context));
  return json({ user }, 201);
});
