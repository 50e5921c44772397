// The one server-side cache: the rendered answer to a signed-in read (a page or a JSON read), kept per person and
// URL while nothing at all has been written to the database since the render began (db/generation.ts). Entries
// live in an LRU with a byte budget (WAKEBOOK_RESPONSE_CACHE_MB; 0 turns it off) and at most MAX_AGE_MS, because
// pages show relative dates. Every kept answer carries an ETag, so a browser's revalidation is answered 304.
// Pages and routes opt in with markCacheable(). See docs/decisions/009-serving-through-the-adapter.md.
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { settings } from './config';
import { writeGeneration } from './db/generation';

export interface CachedAnswer {
  generation: string;
  etag: string;
  status: number;
  headers: [string, string][];
  body: Uint8Array<ArrayBuffer>;
}

/** Rendered pages show relative dates ("due in 3 days"): even without a write an entry lives this long. */
export const MAX_AGE_MS = 60_000;

let lru: LRUCache<string, CachedAnswer> | null | undefined;
let stats = { hits: 0, stores: 0 };

function store(): LRUCache<string, CachedAnswer> | null {
  if (lru !== undefined) return lru;
  // Off under `astro dev`: guides and components change on disk there, which no database generation can see.
  const budget = import.meta.env.MODE === 'development' ? 0 : settings().WAKEBOOK_RESPONSE_CACHE_MB * 1024 * 1024;
  lru =
    budget > 0
      ? new LRUCache<string, CachedAnswer>({
          maxSize: budget,
          // No single page may take more than an eighth of the budget.
          maxEntrySize: budget / 8,
          sizeCalculation: (entry) => entry.body.byteLength + 256,
          ttl: MAX_AGE_MS,
          // The wall clock read on every lookup (no 1 ms reuse), so that a test can move it.
          perf: { now: () => Date.now() },
          ttlResolution: 0,
        })
      : null;
  return lru;
}

/** Called by a page or route whose answer depends only on the signed-in person, the URL and the stored data. */
export function markCacheable(locals: App.Locals): void {
  locals.cacheable = true;
}

/** The key for a person's read of a URL: nobody is ever answered with a page rendered for someone else. */
export function cacheKey(userId: string, url: URL): string {
  return `${userId}\u0000${url.pathname}${url.search}`;
}

/** The kept answer for key, provided nothing has been written since it was rendered. */
export function findAnswer(key: string): CachedAnswer | undefined {
  const cache = store();
  const entry = cache?.get(key);
  if (!entry) return undefined;
  if (entry.generation === writeGeneration()) {
    stats.hits++;
    return entry;
  }
  cache!.delete(key);
  return undefined;
}

/** A strong validator for a body: the same bytes always give the same tag. */
export function etagOf(body: Uint8Array): string {
  return `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`;
}

/** Whether an If-None-Match header names this tag (or is `*`). Weak comparison, as RFC 9110 asks for GET. */
export function matchesTag(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  const bare = etag.replace(/^W\//, '');
  return ifNoneMatch.split(',').some((t) => {
    const tag = t.trim();
    return tag === '*' || tag.replace(/^W\//, '') === bare;
  });
}

/**
 * Reads a rendered 200 answer whole, gives it its ETag and keeps it when the database is still at the generation
 * the render started from (a write during the render would make it stale at once, so it is not kept).
 */
export async function keepAnswer(key: string, generation: string, response: Response): Promise<CachedAnswer> {
  const body = new Uint8Array(await response.arrayBuffer());
  // Cookies belong to the request that set them.
  const headers = [...response.headers].filter(([name]) => name !== 'set-cookie');
  const answer: CachedAnswer = { generation, etag: etagOf(body), status: response.status, headers, body };
  const cache = store();
  if (cache && generation === writeGeneration()) {
    cache.set(key, answer);
    stats.stores++;
  }
  return answer;
}

export function cacheStats() {
  const cache = store();
  return { ...stats, entries: cache?.size ?? 0, bytes: cache?.calculatedSize ?? 0 };
}

/** Empties the cache and reads its budget again (tests, and a restore that swaps the database file). */
export function clearResponseCache(): void {
  lru?.clear();
  lru = undefined;
  stats = { hits: 0, stores: 0 };
}
