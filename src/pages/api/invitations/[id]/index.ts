import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { revokeInvitation } from '~/lib/server/invitations';

/** Revokes a pending invitation (the same as POST …/revoke); its link stops working at once. */
export const DELETE: APIRoute = handle(({ locals, params }) => {
  const actor = requirePermission(locals, 'invitation:manage');
  return json({ invitation: revokeInvitation(params.id ?? '', actor) });
});
