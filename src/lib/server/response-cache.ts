// Keeps the rendered answer to a signed-in read (a page or a JSON read) until a table it read is written
// (src/lib/server/db/changes.ts), so a second view of the same page by the same person costs a lookup instead of
// a render.
// Pages and routes opt in with markCacheable(); the key is the person and the URL, so nobody ever sees a
// page rendered for someone else. See docs/decisions/008-reliability-security-speed.md.
import { stillValid, type Dependencies } from './db/changes';
import { settings } from './config';

interface Entry {
  /** The tables the render read, with their versions when it started. */
  deps: Dependencies;
  expires: number;
  status: number;
  headers: [string, string][];
  /** The same headers as one flat list with the length, ready for Node's writeHead(). */
  raw: string[];
  body: Uint8Array<ArrayBuffer>;
}

/** Rendered pages show relative dates ("due in 3 days"): even without a write an entry lives this long. */
export const MAX_AGE_MS = 60_000;

const entries = new Map<string, Entry>();
let bytes = 0;
let stats = { hits: 0, misses: 0, stores: 0 };

/** Called by a page or route whose answer depends only on the signed-in person, the URL and the data. */
export function markCacheable(locals: App.Locals): void {
  locals.cacheable = true;
}

function capacity(): number {
  // Off under `astro dev`: guides and components change on disk there, which no table version can see.
  if (import.meta.env.MODE === 'development') return 0;
  return settings().WAKEBOOK_RESPONSE_CACHE_MB * 1024 * 1024;
}

/** The cache key for a request, or null when the request is not one the cache may answer. */
export function cacheKey(method: string, url: URL, userId: string | undefined): string | null {
  if (method !== 'GET' || !userId || capacity() === 0) return null;
  return `${userId}\u0000${url.pathname}${url.search}`;
}

/** The stored answer for key when nothing has been written since it was rendered. */
export function cachedEntry(key: string, now = Date.now()): Readonly<Entry> | null {
  const entry = entries.get(key);
  if (entry && entry.expires > now && stillValid(entry.deps)) {
    // Most recently used last, so eviction drops the oldest first.
    entries.delete(key);
    entries.set(key, entry);
    stats.hits++;
    return entry;
  }
  if (entry) drop(key);
  stats.misses++;
  return null;
}

/** The stored answer for key as a Response, or null. */
export function cached(key: string, now = Date.now()): Response | null {
  const entry = cachedEntry(key, now);
  return entry && new Response(entry.body, { status: entry.status, headers: entry.headers });
}

/**
 * Stores a 200 answer with what it depended on and returns a response with the same body. The versions in
 * `deps` are those from before the render: if a write lands during the render the entry is stale at once.
 */
export async function store(key: string, deps: Dependencies, response: Response, now = Date.now()): Promise<Response> {
  const body = new Uint8Array(await response.arrayBuffer());
  // Cookies belong to the request that set them; Astro's own markers are removed from every answer anyway.
  const headers = [...response.headers].filter(([name]) => name !== 'set-cookie' && !name.startsWith('x-astro-'));
  const out = new Response(body, {
    status: response.status,
    statusText: response.statusText,
    headers: response.headers,
  });
  if (response.status !== 200 || body.byteLength > capacity() / 8) return out;
  drop(key);
  const raw = [...headers.flat(), 'content-length', String(body.byteLength)];
  entries.set(key, { deps, expires: now + MAX_AGE_MS, status: response.status, headers, raw, body });
  bytes += body.byteLength;
  stats.stores++;
  for (const [oldest] of entries) {
    if (bytes <= capacity()) break;
    drop(oldest);
  }
  return out;
}

function drop(key: string): void {
  const entry = entries.get(key);
  if (!entry) return;
  bytes -= entry.body.byteLength;
  entries.delete(key);
}

export function cacheStats() {
  return { ...stats, entries: entries.size, bytes };
}

/** Empties the cache (tests, and a restore that swaps the database file). */
export function clearResponseCache(): void {
  entries.clear();
  bytes = 0;
  stats = { hits: 0, misses: 0, stores: 0 };
}
