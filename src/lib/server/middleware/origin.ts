import { defineMiddleware } from 'astro:middleware';
import { errorBody, json } from '../http';
import { settings } from '../config';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Refuses a state-changing request sent from another site, whatever its content type (Astro's own origin check
 * covers form posts only, so a cross-site JSON write would pass it). A request without an Origin header is not a
 * browser's cross-site request (browsers send Origin on every cross-origin POST/PUT/PATCH/DELETE).
 */
export const refuseForeignOrigin = defineMiddleware((context, next) => {
  const origin = context.request.headers.get('origin');
  if (!origin || !STATE_CHANGING.has(context.request.method) || isOurs(origin, context.url)) return next();
  return json(errorBody('forbidden', 'Requests that change data must come from Wakebook itself.'), 403);
});

export function isOurs(origin: string, url: URL): boolean {
  if (origin === url.origin) return true;
  const publicUrl = settings().PUBLIC_URL;
  return publicUrl !== undefined && origin === new URL(publicUrl).origin;
}
