// The service worker (/sw.js), bundled by integrations/service-worker.mjs after `astro build`: Serwist precaches the
// hashed assets, fonts, icons and the offline page; the routes below keep each person's pages under their own name
// (lib/offline/names.ts) and warm them from /api/offline/pack in the background.
import { Serwist, type PrecacheEntry } from 'serwist';
import {
  KEPT_AT,
  OFFLINE_PAGE,
  PACK_KEY,
  belongsToSomeoneElse,
  keptPerson,
  metaCache,
  pagesCache,
  type FromWorker,
  type KeptPack,
  type ToWorker,
} from '../lib/offline/names';
import { applyPack, pagesToWarm, type PackAnswer } from '../lib/offline/pack-merge';

declare const self: ServiceWorkerGlobalScope & { __SW_MANIFEST: (PrecacheEntry | string)[] };
/** Set by the build (integrations/service-worker.mjs): a new build fetches the whole pack again. */
declare const WAKEBOOK_BUILD: string;

/** A navigation waits this long for the network before a kept copy is shown. */
const NAVIGATION_TIMEOUT_MS = 4000;
/** The pack is asked for again at most this often (each page load of a signed-in person may ask). */
const PACK_EVERY_MS = 5 * 60 * 1000;
/** Pages fetched at once, and at most per refresh, when warming the cache from the pack. */
const WARM_AT_ONCE = 3;
const WARM_PER_REFRESH = 250;

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: { cleanupOutdatedCaches: true, concurrency: 4 },
  skipWaiting: true,
  clientsClaim: true,
  disableDevLogs: true,
});

// ---------------------------------------------------------------------------------------------------------------
// Whose data is kept

async function currentPerson(): Promise<string | null> {
  return keptPerson(await caches.keys());
}

/** Deletes every cache of ours that is not `person`'s (everything, for nobody). */
async function forgetAllBut(person: string): Promise<void> {
  generation += 1; // a warm still running for someone else stops at its next step
  const names = await caches.keys();
  await Promise.all(names.filter((n) => belongsToSomeoneElse(n, person)).map((n) => caches.delete(n)));
}

/** Makes `person` the one whose pages are kept (forgetting anyone else first). */
async function becomePerson(person: string): Promise<void> {
  if ((await currentPerson()) === person) return;
  await forgetAllBut(person);
  await caches.open(metaCache(person));
}

/** Bumped whenever the kept person changes: background work for an earlier generation stops. */
let generation = 0;

// ---------------------------------------------------------------------------------------------------------------
// Pages

const PERSON_IN_HTML = /<html\b[^>]*\bdata-person="([^"]+)"/;

/** Keeps a page answer for the person it was rendered for; a signed-out page forgets everyone. The page's HTML. */
async function keep(url: string, response: Response): Promise<string | undefined> {
  if (response.status !== 200 || response.redirected) return undefined;
  if (!(response.headers.get('content-type') ?? '').startsWith('text/html')) return undefined;
  const html = await response.text();
  const person = PERSON_IN_HTML.exec(html.slice(0, 2000))?.[1];
  if (!person) {
    if (!html.includes('data-offline-page')) await forgetAllBut('');
    return undefined;
  }
  await becomePerson(person);
  await putKept(person, url, new Response(html, { status: 200, headers: response.headers }));
  return html;
}

/** Stores an answer in the person's cache, stamped with the moment it was kept. */
async function putKept(person: string, url: string, response: Response): Promise<void> {
  const kept = new Headers(response.headers);
  kept.set(KEPT_AT, new Date().toISOString());
  kept.delete('etag');
  const cache = await caches.open(pagesCache(person));
  await cache.put(url, new Response(await response.blob(), { status: 200, headers: kept }));
}

// Attachments (images, CSV logs) shown on kept pages: kept beside them, for the same person; large files are not.
const ATTACHMENT = /\/api\/attachments\/[A-Za-z0-9_-]+/g;
const ATTACHMENT_MAX_BYTES = 2 * 1024 * 1024;

async function keepAttachment(person: string, url: string, response: Response): Promise<void> {
  const length = Number(response.headers.get('content-length') ?? '0');
  if (response.status !== 200 || length > ATTACHMENT_MAX_BYTES) return;
  if ((await currentPerson()) === person) await putKept(person, url, response);
}

/** Attachments: from the network, kept for the person signed in; offline, the kept copy. */
async function attachment(event: FetchEvent): Promise<Response> {
  const person = await currentPerson();
  try {
    const response = await fetch(event.request);
    if (person) event.waitUntil(keepAttachment(person, event.request.url, response.clone()).catch(() => undefined));
    return response;
  } catch (error) {
    const kept = person ? await (await caches.open(pagesCache(person))).match(event.request.url) : undefined;
    if (kept) return kept;
    throw error;
  }
}

/** Which navigations were answered from the kept pages, by the client they created: the page asks for its age. */
const servedKept = new Map<string, string>();

async function keptAnswer(url: string, clientId: string): Promise<Response | undefined> {
  const person = await currentPerson();
  if (!person) return undefined;
  const cache = await caches.open(pagesCache(person));
  const hit = await cache.match(url, { ignoreVary: true });
  if (hit && clientId) servedKept.set(clientId, hit.headers.get(KEPT_AT) ?? '');
  return hit;
}

async function offlinePage(): Promise<Response> {
  return (
    (await serwist.matchPrecache(OFFLINE_PAGE)) ??
    new Response('You are offline and this page is not kept on this device.', {
      status: 503,
      headers: { 'content-type': 'text/plain; charset=utf-8' },
    })
  );
}

/** Network first (with a timeout), keeping what comes back; offline, the kept copy or the offline page. */
async function navigate(event: FetchEvent): Promise<Response> {
  const { request } = event;
  const url = request.url.split('#')[0];
  const network = fetch(request).then((response) => {
    event.waitUntil(keep(url, response.clone()).catch(() => undefined));
    return response;
  });
  const late = Symbol('late');
  const first = await Promise.race([
    network.catch(() => undefined),
    new Promise<typeof late>((resolve) => setTimeout(() => resolve(late), NAVIGATION_TIMEOUT_MS)),
  ]);
  if (first instanceof Response) return first;
  const kept = await keptAnswer(url, event.resultingClientId);
  if (kept) return kept;
  if (first === late) return network.catch(() => offlinePage());
  return offlinePage();
}

self.addEventListener('fetch', (event) => {
  const { request } = event;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (url.pathname.startsWith('/api/attachments/') && !request.headers.has('range')) {
    event.respondWith(attachment(event));
    return;
  }
  if (request.mode !== 'navigate' || url.pathname.startsWith('/api/')) return;
  if (url.pathname === OFFLINE_PAGE || url.pathname === '/sign-out') return;
  event.respondWith(navigate(event));
});

// ---------------------------------------------------------------------------------------------------------------
// The offline pack: fetched in the background, incrementally, and used to warm the person's pages

async function readPack(person: string): Promise<KeptPack | null> {
  const hit = await (await caches.open(metaCache(person))).match(PACK_KEY);
  if (!hit) return null;
  const pack = (await hit.json()) as KeptPack;
  return pack.build === WAKEBOOK_BUILD ? pack : null;
}

let refreshing: Promise<void> | null = null;

async function refreshPack(person: string): Promise<void> {
  const mine = generation;
  const stillMine = async () => mine === generation && (await currentPerson()) === person;
  const before = await readPack(person);
  if (before && Date.now() - Date.parse(before.refreshedAt) < PACK_EVERY_MS) return;
  const since = before ? `?since=${encodeURIComponent(before.version)}` : '';
  const res = await fetch(`/api/offline/pack${since}`, { credentials: 'same-origin', cache: 'no-store' });
  if (!res.ok) return;
  const answer = (await res.json()) as PackAnswer;
  if (answer.person !== person || !(await stillMine())) return;
  const { pack, dropped } = applyPack(before, answer, WAKEBOOK_BUILD, new Date().toISOString());

  const pages = await caches.open(pagesCache(person));
  for (const url of dropped) await pages.delete(url);
  const keptUrls = new Set((await pages.keys()).map((r) => new URL(r.url).pathname + new URL(r.url).search));
  const queue = pagesToWarm(pack, answer, keptUrls).slice(0, WARM_PER_REFRESH);
  const worker = async () => {
    for (let next = queue.shift(); next; next = queue.shift()) {
      if (!(await stillMine())) return;
      try {
        const page = await fetch(next, { credentials: 'same-origin', redirect: 'error' });
        if (!page.ok || !(await stillMine())) continue;
        const html = await keep(new URL(next, self.location.origin).href, page);
        for (const path of new Set(html?.match(ATTACHMENT) ?? [])) {
          const href = new URL(path, self.location.origin).href;
          if (await pages.match(href)) continue;
          await keepAttachment(person, href, await fetch(href, { credentials: 'same-origin', redirect: 'error' }));
        }
      } catch {
        // Offline again or refused: the next refresh tries again.
      }
    }
  };
  await Promise.all(Array.from({ length: WARM_AT_ONCE }, worker));
  if (!(await stillMine())) return;
  await (await caches.open(metaCache(person))).put(PACK_KEY, Response.json(pack));
  const done: FromWorker = { type: 'warmed', version: pack.version };
  for (const client of await self.clients.matchAll({ type: 'window' })) client.postMessage(done);
}

self.addEventListener('message', (event) => {
  const data = event.data as ToWorker;
  const source = event.source as Client | null;
  if (data?.type === 'forget') {
    event.waitUntil(forgetAllBut(''));
    return;
  }
  if (data?.type !== 'person' || !data.person) return;
  const keptAt = source ? servedKept.get(source.id) : undefined;
  if (source && keptAt !== undefined) {
    servedKept.delete(source.id);
    source.postMessage({ type: 'kept', keptAt } satisfies FromWorker);
  }
  const work = (async () => {
    await becomePerson(data.person);
    refreshing ??= refreshPack(data.person).finally(() => (refreshing = null));
    await refreshing;
  })().catch(() => undefined);
  event.waitUntil(work);
});

serwist.addEventListeners();
