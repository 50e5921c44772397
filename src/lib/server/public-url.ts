import { settings } from './config';

/** The base of links in e-mails: PUBLIC_URL when set (behind a proxy the request origin may be internal). */
export function publicBase(requestUrl: URL | string): string {
  return settings().PUBLIC_URL ?? new URL(requestUrl).origin;
}
