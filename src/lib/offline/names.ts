// What the browser keeps for reading offline, and under which names. Shared by the page script that registers the
// service worker (lib/client/offline.ts), the offline page and the worker itself (src/service-worker/sw.ts); pure.
//
// The per-person rule: every Cache Storage entry and IndexedDB database we create is named `wakebook-…-<personId>`.
// Whenever a page loads for someone else (or for nobody: a signed-out page), everything named `wakebook-…` that
// is not that person's is deleted, so one person's kept pages are never shown to another on the same browser.

export const PREFIX = 'wakebook-';

/** The pages kept for one person (navigations opened online and pages warmed from the offline pack). */
export const pagesCache = (person: string) => `${PREFIX}pages-${person}`;
/** Small facts about what is kept for one person: the offline pack and its version. */
export const metaCache = (person: string) => `${PREFIX}meta-${person}`;
/** The outbox of writes made offline (kept by the off-line writing code in IndexedDB). */
export const outboxDatabase = (person: string) => `${PREFIX}outbox-${person}`;

/** The names that may stay while `person` is the one signed in; anything else under PREFIX is someone else's. */
export function ownNames(person: string): string[] {
  return person ? [pagesCache(person), metaCache(person), outboxDatabase(person)] : [];
}

/** Whether a cache or database name is ours and must go while `person` is signed in (nobody: empty string). */
export function belongsToSomeoneElse(name: string, person: string): boolean {
  return name.startsWith(PREFIX) && !ownNames(person).includes(name);
}

/** The person whose data is kept, read from the name of their meta cache; null when nothing (or something odd) is. */
export function keptPerson(cacheNames: string[]): string | null {
  const metas = cacheNames.filter((n) => n.startsWith(`${PREFIX}meta-`));
  return metas.length === 1 ? metas[0].slice(`${PREFIX}meta-`.length) : null;
}

/** Header the worker adds to every page it keeps: when it was kept (ISO time). */
export const KEPT_AT = 'x-wakebook-kept-at';

/** Keys inside the meta cache (never fetched from the network). */
export const PACK_KEY = '/__wakebook/pack';

/** The page a navigation that is not kept gets while offline (precached). */
export const OFFLINE_PAGE = '/offline';

/** What the offline pack's items are, in the order the offline page lists them. */
export const PACK_GROUPS = ['guides', 'records', 'calculations', 'calculators', 'onboarding'] as const;
export type PackGroup = (typeof PACK_GROUPS)[number];

/** One page the pack asks the browser to keep. */
export interface PackItem {
  url: string;
  title: string;
  updatedAt: string;
}

/** What the worker stores in the meta cache under PACK_KEY. */
export interface KeptPack {
  /** The worker's build: a new build fetches the whole pack again. */
  build: string;
  version: string;
  refreshedAt: string;
  groups: Record<PackGroup, PackItem[]>;
}

/** Messages from a page to the worker. */
export type ToWorker = { type: 'person'; person: string } | { type: 'forget' };
/** Messages from the worker to a page. */
export type FromWorker = { type: 'kept'; keptAt: string } | { type: 'warmed'; version: string };
