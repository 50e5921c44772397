import type { APIRoute } from 'astro';
import { handle, readJson, requireUser } from '~/lib/server/http';
import { changePasswordSchema } from '~/lib/server/auth/new-password';
import { changePassword } from '~/lib/server/auth/change-password';
import { clientAddress } from '~/lib/server/client-address';
import { publicBase } from '~/lib/server/public-url';

/** Changes the caller's own password (current one required); their other sessions end, this one stays. */
export const POST: APIRoute = handle(async (context) => {
  const user = requireUser(context.locals);
  const input = await readJson(context.request, changePasswordSchema, 16 * 1024);
  await changePassword(user, context.locals.session?.id ?? '', input, clientAddress(context), publicBase(context.url));
  return new Response(null, { status: 204, headers: { 'cache-control': 'no-store' } });
});
