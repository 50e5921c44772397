import { defineMiddleware } from 'astro:middleware';
import {
  IDEMPOTENCY_HEADER,
  claimKey,
  coversRequest,
  invalidKeyResponse,
  isValidKey,
  keepAnswer,
  releaseKey,
} from '../idempotency';

/**
 * A signed-in API write carrying an `Idempotency-Key` is carried out once: a repeat gets the first answer again
 * (`lib/server/idempotency.ts`). Writes without the header go on as before.
 */
export const answerWritesOnce = defineMiddleware(async (context, next) => {
  const { request, locals, url } = context;
  const key = request.headers.get(IDEMPOTENCY_HEADER);
  if (key === null || !locals.user || !coversRequest(request.method, url.pathname)) return next();
  if (!isValidKey(key)) return invalidKeyResponse();
  const userId = locals.user.id;
  const claim = claimKey(userId, key, request.method, url.pathname);
  if (claim.kind === 'answer') return claim.response;
  let response: Response;
  try {
    response = await next();
  } catch (e) {
    releaseKey(userId, key);
    throw e;
  }
  return keepAnswer(userId, key, response);
});
