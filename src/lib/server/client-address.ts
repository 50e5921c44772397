import type { APIContext } from 'astro';
import { settings } from './config';

/**
 * The address throttling and the audit log attribute a request to. Astro's `clientAddress` follows
 * X-Forwarded-For, which any caller can set, so it counts only when WAKEBOOK_TRUST_PROXY says a proxy of ours
 * sets it; otherwise the socket's peer, which the start file passes in as `locals.socketAddress`. Without one (dev
 * server, tests) Astro's value is all there is.
 */
export function clientAddress(context: Pick<APIContext, 'clientAddress' | 'locals'>): string {
  if (!settings().WAKEBOOK_TRUST_PROXY && context.locals.socketAddress) return context.locals.socketAddress;
  try {
    return context.clientAddress || 'unknown';
  } catch {
    // Astro throws where the adapter cannot tell the address.
    return 'unknown';
  }
}
