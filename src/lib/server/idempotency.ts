import { and, eq, lt } from 'drizzle-orm';
import { db } from './db/client';
import { idempotencyKeys } from './db/schema';
import { errorBody, json } from './http';

/**
 * Idempotency keys: a write sent with an `Idempotency-Key` header is carried out once per (person, key). The first
 * answer (status and JSON body) is kept for a day; a repeat of the same method and path gets it again, marked with
 * `Idempotency-Replayed: true`. A browser that lost the answer to a write (the network dropped just after the
 * server saved it) can therefore send it again without making a second record.
 *
 * The key is claimed with a row of status 0 before the write runs, so a repeat arriving while the first is still
 * running is told so (409) instead of running twice. 5xx answers (and thrown errors) release the key: the write did
 * not happen, so trying again must be allowed. Only API routes are covered: their answers are JSON, which the table
 * can replay exactly (a page's form post answers with a redirect, and browsers cannot add the header to it anyway).
 */

export const IDEMPOTENCY_HEADER = 'idempotency-key';
const KEY_PATTERN = /^[A-Za-z0-9_-]{8,128}$/;
/** How long an answer is kept. */
export const KEEP_MS = 24 * 60 * 60 * 1000;
/** A claim older than this belongs to a process that stopped mid-write; a repeat may take it over. */
const STALE_CLAIM_MS = 2 * 60 * 1000;
const PRUNE_EVERY_MS = 10 * 60 * 1000;
const RUNNING = 0;

/** Whether this request is one the keys cover. */
export function coversRequest(method: string, path: string): boolean {
  return (
    (method === 'POST' || method === 'PUT' || method === 'PATCH' || method === 'DELETE') && path.startsWith('/api/')
  );
}

export function isValidKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

let lastPrune = 0;

/** Deletes answers older than a day; runs on the first write of the process and then at most every ten minutes. */
export function pruneOldKeys(now = Date.now()): number {
  lastPrune = now;
  return db()
    .delete(idempotencyKeys)
    .where(lt(idempotencyKeys.createdAt, new Date(now - KEEP_MS)))
    .run().changes;
}

type Claim = { kind: 'run' } | { kind: 'answer'; response: Response };

/** Claims the key for this write, or says how to answer instead (replay, 409 still running, 422 other request). */
export function claimKey(userId: string, key: string, method: string, path: string, now = Date.now()): Claim {
  if (now - lastPrune > PRUNE_EVERY_MS) pruneOldKeys(now);
  const d = db();
  const inserted = d
    .insert(idempotencyKeys)
    .values({ userId, key, method, path, status: RUNNING, body: '', createdAt: new Date(now) })
    .onConflictDoNothing()
    .run();
  if (inserted.changes === 1) return { kind: 'run' };
  const row = d
    .select()
    .from(idempotencyKeys)
    .where(and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.key, key)))
    .get();
  if (!row) return claimKey(userId, key, method, path, now); // pruned in between: claim afresh
  if (row.method !== method || row.path !== path)
    return {
      kind: 'answer',
      response: json(
        errorBody(
          'idempotency_key_reused',
          `This Idempotency-Key was already used for ${row.method} ${row.path}; send a new key for a different change.`,
        ),
        422,
      ),
    };
  if (row.status === RUNNING) {
    if (now - row.createdAt.getTime() < STALE_CLAIM_MS)
      return {
        kind: 'answer',
        response: json(
          errorBody(
            'conflict',
            'This change is still being saved from an earlier attempt; wait a moment and ask again for its answer.',
          ),
          409,
          { 'retry-after': '2' },
        ),
      };
    const taken = d
      .update(idempotencyKeys)
      .set({ createdAt: new Date(now) })
      .where(
        and(
          eq(idempotencyKeys.userId, userId),
          eq(idempotencyKeys.key, key),
          eq(idempotencyKeys.status, RUNNING),
          eq(idempotencyKeys.createdAt, row.createdAt),
        ),
      )
      .run();
    if (taken.changes === 1) return { kind: 'run' };
    return claimKey(userId, key, method, path, now);
  }
  return { kind: 'answer', response: replay(row.status, row.body) };
}

function replay(status: number, body: string): Response {
  const headers = {
    'content-type': 'application/json; charset=utf-8',
    'cache-control': 'no-store',
    'idempotency-replayed': 'true',
  };
  return new Response(status === 204 || body === '' ? null : body, { status, headers });
}

/**
 * Keeps the answer of a claimed write and hands back an equivalent response (the body has been read). Server errors
 * and "try later" answers (429) release the key instead, so the same key may be sent again.
 */
export async function keepAnswer(userId: string, key: string, response: Response): Promise<Response> {
  if (response.status >= 500 || response.status === 429) {
    releaseKey(userId, key);
    return response;
  }
  const body = response.status === 204 ? '' : await response.text();
  db()
    .update(idempotencyKeys)
    .set({ status: response.status, body })
    .where(and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.key, key)))
    .run();
  return new Response(response.status === 204 ? null : body, {
    status: response.status,
    statusText: response.statusText,
    headers: response.headers,
  });
}

/** Forgets a claim whose write did not happen (a server error, or an exception on the way). */
export function releaseKey(userId: string, key: string): void {
  db()
    .delete(idempotencyKeys)
    .where(and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.key, key), eq(idempotencyKeys.status, RUNNING)))
    .run();
}

export function invalidKeyResponse(): Response {
  return json(
    errorBody('invalid_input', 'The Idempotency-Key header must be 8 to 128 letters, digits, dashes or underscores.', [
      { path: 'Idempotency-Key', message: 'Use 8 to 128 characters: A–Z, a–z, 0–9, - or _.' },
    ]),
    400,
  );
}
