import type { APIRoute } from 'astro';
import { handle, json, readJson, HttpError } from '~/lib/server/http';
import { signInInputSchema } from '~/lib/schemas/auth';
import { attemptSignIn } from '~/lib/server/auth/sign-in';
import { clientAddress } from '~/lib/server/client-address';

export const POST: APIRoute = handle(async (context) => {
  const input = await readJson(context.request, signInInputSchema, 16 * 1024);
  const result = await attemptSignIn(input, clientAddress(context), context.cookies);
  if (result.ok) return json({ user: result.user });
  if (result.reason === 'throttled') {
    throw new HttpError(
      429,
      'rate_limited',
      'Too many attempts. Wait a few minutes and try again.',
      [],
      { retryAfter: result.retryAfter },
      {
        'retry-after': String(result.retryAfter),
      },
    );
  }
  throw new HttpError(401, 'invalid_credentials', 'That e-mail and password do not match an account.');
});
