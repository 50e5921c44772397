import { defineMiddleware } from 'astro:middleware';
import { withSecurityHeaders } from '../security-headers';

/** Adds the security headers (and each page's content security policy) to every answer. */
export const addSecurityHeaders = defineMiddleware(async (_context, next) => withSecurityHeaders(await next()));
