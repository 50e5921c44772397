import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { revokeInvitation } from '~/lib/server/invitations';

export const POST: APIRoute = handle(({ locals, params }) => {
  const actor = requirePermission(locals, 'invitation:manage');
  return json({ invitation: revokeInvitation(params.id ?? '', actor) });
});
