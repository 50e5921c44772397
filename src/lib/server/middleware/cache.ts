import { defineMiddleware } from 'astro:middleware';
import { writeGeneration } from '../db/generation';
import { cacheKey, findAnswer, keepAnswer, matchesTag, type CachedAnswer } from '../response-cache';

/**
 * Signed-in reads that a page or route marked cacheable: answered from the response cache while nothing has been
 * written, otherwise rendered and kept. Either way they carry an ETag and `Cache-Control: private, no-cache`, and a
 * browser that already holds the same bytes (If-None-Match) gets 304 with no body.
 */
export const answerFromCache = defineMiddleware(async (context, next) => {
  const { request, locals, url } = context;
  if (request.method !== 'GET' || !locals.user) return next();
  const key = cacheKey(locals.user.id, url);
  const ifNoneMatch = request.headers.get('if-none-match');
  const kept = findAnswer(key);
  if (kept) return answerWith(kept, ifNoneMatch);
  const generation = writeGeneration();
  const response = await next();
  if (!locals.cacheable || response.status !== 200) return response;
  return answerWith(await keepAnswer(key, generation, response), ifNoneMatch);
});

function answerWith(kept: CachedAnswer, ifNoneMatch: string | null): Response {
  const headers = new Headers(kept.headers);
  headers.set('etag', kept.etag);
  headers.set('cache-control', 'private, no-cache');
  if (matchesTag(ifNoneMatch, kept.etag)) {
    // The browser replaces its stored headers with these (RFC 9111 §4.3.4), so the 304 carries the same type and
    // hence the same page policy as the 200 it revalidates; only the length goes.
    headers.delete('content-length');
    return new Response(null, { status: 304, headers });
  }
  return new Response(kept.body, { status: kept.status, headers });
}
