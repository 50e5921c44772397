import type { APIRoute } from 'astro';
import { handle } from '~/lib/server/http';
import { endSession } from '~/lib/server/auth/lucia';
import { recordAudit } from '~/lib/server/audit';

export const POST: APIRoute = handle(async ({ locals, cookies }) => {
  await endSession(locals.session?.id, cookies);
  if (locals.user)
    recordAudit({ actor: locals.user, action: 'auth.sign-out', targetType: 'user', targetId: locals.user.id });
  return new Response(null, { status: 204 });
});
