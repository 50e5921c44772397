import { createHash, timingSafeEqual } from 'node:crypto';
import { settings } from './config';

/**
 * True when the request carries `Authorization: Bearer <WAKEBOOK_CRON_TOKEN>`. Compared in constant time over
 * fixed-length digests, so neither the content nor the length of the secret leaks through timing.
 */
export function isCronRequest(request: Request, secret: string | undefined = settings().WAKEBOOK_CRON_TOKEN): boolean {
  if (!secret) return false;
  const header = request.headers.get('authorization') ?? '';
  const m = /^Bearer (.+)$/.exec(header);
  if (!m) return false;
  const digest = (s: string) => createHash('sha256').update(s, 'utf8').digest();
  return timingSafeEqual(digest(m[1]), digest(secret));
}
