import { defineMiddleware } from 'astro:middleware';
import { readSession } from './lib/server/auth/lucia';
import { ensureBooted } from './lib/server/boot';
import { currentVersions, dependencies, readingInto } from './lib/server/db/changes';
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
  if (!key) return withSecurityHeaders(await next());
  const hit = cached(key);
  if (hit) return hit;
  // Astro renders a page while its body is read, so the body is read inside the scope that records the tables.
  const start = currentVersions();
  const read = new Set<string>();
  const response = await readingInto(read, async () => withSecurityHeaders(await next()));
  // Every page shows the signed-in person (name, role): a change to people is a change to the page.
  read.add('users');
  return context.locals.cacheable ? store(key, dependencies(start, read), response) : response;
});

// The built entry (integrations/server-entry.mjs) boots before listening and sends requests through the front door.
Object.assign(globalThis, { __wakebookBoot: ensureBooted, __wakebookFrontDoor: frontDoor });
