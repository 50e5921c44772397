import { defineMiddleware, sequence } from 'astro:middleware';
import { readSession } from './lib/server/auth/lucia';
import { ensureBooted } from './lib/server/boot';
import { withSecurityHeaders } from './lib/server/security-headers';

/** Fills locals from the session cookie. Authorisation is decided in each page and route. */
const session = defineMiddleware(async (context, next) => {
  await ensureBooted();
  const { user, session } = await readSession(context.cookies);
  context.locals.user = user;
  context.locals.session = session;
  return next();
});

const headers = defineMiddleware(async (_context, next) => withSecurityHeaders(await next()));

export const onRequest = sequence(headers, session);

// The built entry calls this before listening (integrations/boot-at-start.mjs).
(globalThis as { __wakebookBoot?: () => Promise<void> }).__wakebookBoot = ensureBooted;
