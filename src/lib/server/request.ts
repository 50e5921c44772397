import type { APIContext } from 'astro';

/** The caller's address, or 'unknown' where the adapter cannot tell (tests, some proxies). */
export function clientIp(context: Pick<APIContext, 'clientAddress'>): string {
  try {
    return context.clientAddress || 'unknown';
  } catch {
    return 'unknown';
  }
}
