import type { APIRoute } from 'astro';
import { handle, json, readJson, HttpError } from '~/lib/server/http';
import { requestResetSchema } from '~/lib/schemas/auth';
import { requestPasswordReset } from '~/lib/server/auth/reset';
import { clientAddress } from '~/lib/server/client-address';
import { publicBase } from '~/lib/server/public-url';

/** 202 whether or not the address has an account (no enumeration); 429 when asked too often. */
export const POST: APIRoute = handle(async (context) => {
  const input = await readJson(context.request, requestResetSchema, 16 * 1024);
  const result = requestPasswordReset(input.email, clientAddress(context), publicBase(context.url));
  if (!result.ok) {
    throw new HttpError(
      429,
      'rate_limited',
      'Too many reset requests. Wait a few minutes and try again.',
      [],
      { retryAfter: result.retryAfter },
      {
        'retry-after': String(result.retryAfter),
      },
    );
  }
  return json({ ok: true, message: 'If that address has an account, a reset link is on its way.' }, 202);
});
