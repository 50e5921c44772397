import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { resendInvitation } from '~/lib/server/invitations';
import { publicBase } from '~/lib/server/public-url';

export const POST: APIRoute = handle(async ({ locals, params, url }) => {
  const actor = requirePermission(locals, 'invitation:manage');
  return json(await resendInvitation(params.id ?? '', actor, publicBase(url)));
});
