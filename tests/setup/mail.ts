import { listOutbox } from '../../src/lib/server/mail/outbox';

/** The link in a captured message: the first http(s) address in its text part. */
export function linkIn(text: string): string {
  const m = /https?:\/\/\S+/.exec(text);
  if (!m) throw new Error(`no link in message:\n${text}`);
  return m[0];
}

/** The token is the last path segment of the link (API.md). */
export function tokenIn(text: string): string {
  return new URL(linkIn(text)).pathname.split('/').pop()!;
}

/** The newest captured message to an address. */
export function latestMailTo(address: string) {
  const m = listOutbox().find((x) => x.to === address);
  if (!m) throw new Error(`no captured mail to ${address}`);
  return m;
}

export function mailCountTo(address: string): number {
  return listOutbox().filter((x) => x.to === address).length;
}
