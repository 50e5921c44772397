import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { invitationInputSchema } from '~/lib/schemas/people';
import { createInvitation, listInvitations } from '~/lib/server/invitations';
import { publicBase } from '~/lib/server/public-url';

export const GET: APIRoute = handle(({ locals }) => {
  requirePermission(locals, 'invitation:manage');
  return json({ invitations: listInvitations() });
});

export const POST: APIRoute = handle(async ({ locals, request, url }) => {
  const actor = requirePermission(locals, 'invitation:manage');
  const input = await readJson(request, invitationInputSchema, 16 * 1024);
  const result = await createInvitation(input, actor, publicBase(url));
  return json(result, 201);
});
