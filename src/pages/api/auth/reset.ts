import type { APIRoute } from 'astro';
import { handle, readJson } from '~/lib/server/http';
import { resetPasswordSchema } from '~/lib/server/auth/new-password';
import { resetPassword } from '~/lib/server/auth/reset';
import { clientAddress } from '~/lib/server/client-address';

export const POST: APIRoute = handle(async (context) => {
  const input = await readJson(context.request, resetPasswordSchema, 16 * 1024);
  await resetPassword(input.token, input.password, clientAddress(context));
  return new Response(null, { status: 204, headers: { 'cache-control': 'no-store' } });
});
