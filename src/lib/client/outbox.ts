// The outbox: writes made while the network is away, kept in this browser (IndexedDB, one database per person) and
// sent through their ordinary routes, oldest first, when it is back. Each keeps the Idempotency-Key it was first
// sent with, so a write whose answer was lost is answered once by the server, never made twice.
import { openDB, type IDBPDatabase } from 'idb';
import { OUTBOX_CHANGED, hintKey, newKey } from './api';

export type OutboxState = 'waiting' | 'sending' | 'conflict' | 'failed';

export interface OutboxEntry {
  id: string;
  /** The Idempotency-Key every attempt carries. */
  key: string;
  method: string;
  url: string;
  body: unknown;
  /** The record version an edit was made on. */
  baseVersion?: number;
  /** What it is, in words: "Edit of ‘Hull trim tabs’", "New lesson", "Question on …". */
  label: string;
  createdAt: string;
  state: OutboxState;
  /** Why it needs the person: the API's message. */
  message?: string;
}

const STORE = 'changes';
const DB_PREFIX = 'wakebook-outbox-';

/** Whose page this is (set on <html> by the layout); only that person's outbox is opened or sent. */
function personId(): string | undefined {
  return document.documentElement.dataset.person || undefined;
}

let opened: { person: string; db: Promise<IDBPDatabase> } | undefined;

function outboxDb(): Promise<IDBPDatabase> | null {
  const person = personId();
  if (!person) return null;
  if (opened?.person !== person) {
    const db = openDB(DB_PREFIX + person, 1, {
      upgrade(d) {
        d.createObjectStore(STORE, { keyPath: 'id' });
      },
      // Signing out deletes the database: let it go at once instead of blocking the deletion.
      blocking() {
        void db.then((d) => d.close());
        opened = undefined;
      },
    });
    opened = { person, db };
  }
  return opened.db;
}

const channel = typeof BroadcastChannel === 'function' ? new BroadcastChannel('wakebook-outbox') : null;

function changed(): void {
  void listChanges().then((all) => writeHint(all.length));
  window.dispatchEvent(new Event(OUTBOX_CHANGED));
  channel?.postMessage('changed');
}

/** Calls `fn` whenever the outbox changes, in this tab or another. */
export function onOutboxChange(fn: () => void): void {
  window.addEventListener(OUTBOX_CHANGED, fn);
  channel?.addEventListener('message', fn);
}

/** The person's kept changes, oldest first. */
export async function listChanges(): Promise<OutboxEntry[]> {
  const db = outboxDb();
  if (!db) return [];
  const all = ((await (await db).getAll(STORE)) as OutboxEntry[]).sort((a, b) =>
    a.createdAt === b.createdAt ? a.id.localeCompare(b.id) : a.createdAt.localeCompare(b.createdAt),
  );
  return all;
}

export async function getChange(id: string): Promise<OutboxEntry | undefined> {
  const db = outboxDb();
  return db ? ((await (await db).get(STORE, id)) as OutboxEntry | undefined) : undefined;
}

async function put(entry: OutboxEntry): Promise<void> {
  const db = outboxDb();
  if (!db) throw new Error('No one is signed in on this page.');
  await (await db).put(STORE, entry);
  changed();
}

export async function discardChange(id: string): Promise<void> {
  const db = outboxDb();
  if (!db) return;
  await (await db).delete(STORE, id);
  changed();
}

/** Keeps a write that could not be sent. */
export async function keepChange(
  c: Pick<OutboxEntry, 'key' | 'method' | 'url' | 'body' | 'label' | 'baseVersion'>,
): Promise<OutboxEntry> {
  const entry: OutboxEntry = { ...c, id: newKey(), createdAt: new Date().toISOString(), state: 'waiting' };
  await put(entry);
  return entry;
}

/**
 * Puts a refused change back in the queue (the person asked to send it again). The server refused it, so nothing was
 * made: it goes with a new key (the old one would only replay the refusal).
 */
export async function retryChange(id: string): Promise<void> {
  const entry = await getChange(id);
  if (entry) await put({ ...entry, key: newKey(), state: 'waiting', message: undefined });
}

/** The text a person typed in a change, for copying out of a change that cannot be sent. */
export function changeText(entry: OutboxEntry): string {
  const out: string[] = [];
  const walk = (v: unknown, name = ''): void => {
    if (typeof v === 'string') {
      if (name === 'title' || name === 'text' || (name === 'body' && v.trim())) out.push(v);
    } else if (Array.isArray(v)) v.forEach((x) => walk(x));
    else if (v && typeof v === 'object') {
      const o = v as Record<string, unknown>;
      for (const [k, x] of Object.entries(o)) walk(x, k);
      if (o.type === 'paragraph' || o.type === 'heading') out.push('\n');
    }
  };
  walk(entry.body);
  return out
    .join('')
    .replace(/\n{3,}/g, '\n\n')
    .trim();
}

/** The record an entry writes to, when it is a record edit (for the merge view). */
export function recordOf(entry: OutboxEntry): string | null {
  const m = /^\/api\/records\/([^/?]+)$/.exec(entry.url);
  return m && entry.method === 'PATCH' ? decodeURIComponent(m[1]) : null;
}

let running: Promise<void> | null = null;

/**
 * Sends the waiting changes, oldest first, each through its own route with its key. A 2xx removes it; a stale record
 * version becomes a `conflict` for the merge view; any other refusal becomes `failed` with the API's message; a
 * network failure or a server error leaves it waiting and stops (the next page load or `online` tries again).
 */
export function sendWaiting(): Promise<void> {
  if (!navigator.onLine || !personId()) return Promise.resolve();
  running ??= (async () => {
    try {
      const go = async () => {
        for (const entry of await listChanges()) {
          if (entry.state !== 'waiting' && entry.state !== 'sending') continue;
          if (!(await sendOne(entry))) break;
        }
      };
      // One tab sends at a time; another tab asking meanwhile leaves it to the one already sending.
      if (navigator.locks)
        await navigator.locks.request('wakebook-outbox-send', { ifAvailable: true }, (lock) => lock && go());
      else await go();
    } finally {
      running = null;
      changed();
    }
  })();
  return running;
}

/** Whether a send run is going on in this tab. */
export function isSending(): boolean {
  return running !== null;
}

async function sendOne(entry: OutboxEntry): Promise<boolean> {
  await put({ ...entry, state: 'sending' });
  let res: Response;
  try {
    res = await fetch(entry.url, {
      method: entry.method,
      headers: { 'content-type': 'application/json', accept: 'application/json', 'idempotency-key': entry.key },
      body: entry.body === undefined ? undefined : JSON.stringify(entry.body),
      credentials: 'same-origin',
    });
  } catch {
    await put({ ...entry, state: 'waiting' });
    return false;
  }
  if (res.ok) {
    await discardChange(entry.id);
    return true;
  }
  const message = await res
    .json()
    .then((b: { error?: { message?: string; current?: unknown; issues?: { message: string }[] } }) => b.error)
    .catch(() => undefined);
  // Try later: the server failed, is busy, still saving an earlier attempt (409 with Retry-After), or the session
  // ended (signing in again as the same person sends it).
  if (res.status >= 500 || res.status === 429 || res.status === 401 || res.headers.has('retry-after')) {
    await put({
      ...entry,
      state: 'waiting',
      message: res.status === 401 ? 'Sign in again to send this change.' : entry.message,
    });
    return false;
  }
  const conflict = res.status === 409 && recordOf(entry) !== null && message?.current !== undefined;
  await put({
    ...entry,
    state: conflict ? 'conflict' : 'failed',
    message: conflict
      ? 'Someone else saved this record meanwhile. Resolve it in the merge view.'
      : [message?.message ?? `The server refused it (${res.status}).`, ...(message?.issues ?? []).map((i) => i.message)]
          .filter((m, i, all) => all.indexOf(m) === i)
          .join(' '),
  });
  return true;
}

/** Mirrors the number of kept changes where every page reads it at once (api.ts readHint). */
function writeHint(count: number): void {
  try {
    if (count > 0) window.localStorage.setItem(hintKey(), String(count));
    else window.localStorage.removeItem(hintKey());
  } catch {
    // storage blocked: pages load the outbox only once something is kept in them
  }
}
