import { sequence } from 'astro:middleware';
import { boot } from './lib/server/middleware/boot';
import { answerFromCache } from './lib/server/middleware/cache';
import { answerWritesOnce } from './lib/server/middleware/idempotency';
import { refuseForeignOrigin } from './lib/server/middleware/origin';
import { addSecurityHeaders } from './lib/server/middleware/security';
import { readSessionIntoLocals } from './lib/server/middleware/session';

/**
 * Every request, in order: the database is open; a cross-site write is refused; the session fills locals; the
 * security headers are added to whatever comes back; an API write sent with an Idempotency-Key is carried out once
 * (a repeat gets the first answer); a repeated signed-in read is answered from the cache (or 304).
 * Authorisation is decided in each page and route.
 */
export const onRequest = sequence(
  boot,
  refuseForeignOrigin,
  readSessionIntoLocals,
  addSecurityHeaders,
  answerWritesOnce,
  answerFromCache,
);
