import { defineMiddleware } from 'astro:middleware';
import { readSession } from './lib/server/auth/lucia';
import { ensureBooted } from './lib/server/boot';
import { dataVersion } from './lib/server/db/client';
import { frontDoor } from './lib/server/front-door';
import { cacheKey, cached, store } from './lib/server/response-cache';
import { withSecurityHeaders } from './lib/server/security-headers';

/**
 * Fills locals from the session cookie, answers a repeated signed-in read from the response cache, and adds
 * the security headers. Authorisation is decided in each page and route.
 */
export const onRequest = defineMiddleware(async (context, next) => {
  await ensureBooted();
  const { user, session } = await readSession(context.cookies, context.locals.sessionCheck);
  context.locals.user = user;
  context.locals.session = session;
  const key = cacheKey(context.request.method, context.url, user?.id);
  if (key) {
    const hit = cached(key);
    if (hit) return hit;
  }
  const version = key ? dataVersion() : '';
  const response = await withSecurityHeaders(await next());
  return key && context.locals.cacheable ? store(key, version, response) : response;
});

// The built entry (integrations/server-entry.mjs) boots before listening and sends requests through the front door.
Object.assign(globalThis, { __wakebookBoot: ensureBooted, __wakebookFrontDoor: frontDoor });
