import { describe, it, expect, beforeAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { APIRoute } from 'astro';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import { templateFor } from '../../src/lib/editor/templates';
import { db } from '../../src/lib/server/db/client';
import { idempotencyKeys } from '../../src/lib/server/db/schema';
import { KEEP_MS, pruneOldKeys } from '../../src/lib/server/idempotency';
import { json } from '../../src/lib/server/http';
import { eq } from 'drizzle-orm';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const lesson = (title: string) => ({ kind: 'lesson', title, subsystem: 'battery', body: templateFor('lesson') });
const RECORDS = '/api/records';

async function countTitled(title: string, session = s.lead): Promise<number> {
  const res = await call(recordsRoute, 'GET', { session, path: RECORDS, query: { limit: '100', kind: 'lesson' } });
  expect(res.status).toBe(200);
  return res.body.records.filter((r: { title: string }) => r.title === title).length;
}

function post(title: string, key: string | undefined, role: DemoRole = 'member', path = RECORDS) {
  return call(recordsRoute, 'POST', {
    session: s[role],
    path,
    body: lesson(title),
    headers: key === undefined ? {} : { 'Idempotency-Key': key },
  });
}

describe('Idempotency-Key on writes', () => {
  it('the same key twice makes one record and answers the same both times, the repeat marked as replayed', async () => {
    const key = randomUUID();
    const first = await post('Trim tab hinge cracked twice', key);
    expect(first.status).toBe(201);
    expect(first.headers.get('idempotency-replayed')).toBeNull();
    const again = await post('Trim tab hinge cracked twice', key);
    expect(again.status).toBe(201);
    expect(again.headers.get('idempotency-replayed')).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await countTitled('Trim tab hinge cracked twice')).toBe(1);
  });

  it('different keys make two records; a write without a key behaves as before', async () => {
    expect((await post('Bilge pump fuse blew', randomUUID())).status).toBe(201);
    expect((await post('Bilge pump fuse blew', randomUUID())).status).toBe(201);
    expect(await countTitled('Bilge pump fuse blew')).toBe(2);
    const a = await post('Rudder stock bent', undefined);
    const b = await post('Rudder stock bent', undefined);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.headers.get('idempotency-replayed')).toBeNull();
    expect(await countTitled('Rudder stock bent')).toBe(2);
  });

  it('the same key on another method or path is refused with 422 and changes nothing', async () => {
    const key = randomUUID();
    const created = await post('Skeg epoxy cured soft', key);
    expect(created.status).toBe(201);
    const id = created.body.record.id as string;
    const patch = await call(recordRoute, 'PATCH', {
      session: s.member,
      path: `/api/records/${id}`,
      params: { id },
      body: { version: created.body.record.version, title: 'Changed under a reused key' },
      headers: { 'Idempotency-Key': key },
    });
    expect(patch.status).toBe(422);
    expect(patch.body.error.code).toBe('idempotency_key_reused');
    expect(patch.body.error.message).toContain('POST /api/records');
    const comment = await call(commentsRoute, 'POST', {
      session: s.member,
      path: `/api/records/${id}/comments`,
      params: { id },
      body: { body: 'Was the shed cold?' },
      headers: { 'Idempotency-Key': key },
    });
    expect(comment.status).toBe(422);
    const now = await call(recordRoute, 'GET', { session: s.member, path: `/api/records/${id}`, params: { id } });
    expect(now.body.record.title).toBe('Skeg epoxy cured soft');
    expect(now.body.record.version).toBe(created.body.record.version);
  });

  it('a malformed key is 400 invalid_input and nothing is written', async () => {
    for (const bad of ['short', 'x'.repeat(129), 'has space in it', 'semi;colon12', 'ümlaut-key-1']) {
      const res = await post('Never written: bad key', bad);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.issues[0].path).toBe('Idempotency-Key');
    }
    expect(await countTitled('Never written: bad key')).toBe(0);
    // The limits themselves are accepted.
    expect((await post('Key of eight', 'abcd_-12')).status).toBe(201);
    expect((await post('Key of 128', 'k'.repeat(128))).status).toBe(201);
  });

  it("another person's same key is independent", async () => {
    const key = randomUUID();
    const mine = await post('Prop shaft seal weeps', key, 'member');
    const theirs = await post('Prop shaft seal weeps', key, 'lead');
    expect([mine.status, theirs.status]).toEqual([201, 201]);
    expect(theirs.headers.get('idempotency-replayed')).toBeNull();
    expect(theirs.body.record.id).not.toBe(mine.body.record.id);
    expect(await countTitled('Prop shaft seal weeps')).toBe(2);
  });

  it('a refused write (4xx) is remembered too: the repeat gets the same refusal', async () => {
    const key = randomUUID();
    const first = await call(recordsRoute, 'POST', {
      session: s.member,
      path: RECORDS,
      body: { ...lesson(''), title: '' },
      headers: { 'Idempotency-Key': key },
    });
    expect(first.status).toBe(400);
    const again = await call(recordsRoute, 'POST', {
      session: s.member,
      path: RECORDS,
      body: { ...lesson(''), title: '' },
      headers: { 'Idempotency-Key': key },
    });
    expect(again.status).toBe(400);
    expect(again.headers.get('idempotency-replayed')).toBe('true');
    expect(again.body).toEqual(first.body);
  });

  it('a repeat while the first is still running is 409 with a clear message; then it replays', async () => {
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    let runs = 0;
    const slow: Partial<Record<'POST', APIRoute>> = {
      POST: async () => {
        runs += 1;
        await gate;
        return json({ made: runs }, 201);
      },
    };
    const key = randomUUID();
    const opts = { session: s.member, path: '/api/slow-write', headers: { 'Idempotency-Key': key }, body: {} };
    const first = call(slow, 'POST', opts);
    await new Promise((r) => setTimeout(r, 20));
    const during = await call(slow, 'POST', opts);
    expect(during.status).toBe(409);
    expect(during.body.error.code).toBe('conflict');
    expect(during.body.error.message).toMatch(/still being saved/);
    release();
    expect((await first).status).toBe(201);
    const after = await call(slow, 'POST', opts);
    expect(after.status).toBe(201);
    expect(after.body).toEqual({ made: 1 });
    expect(after.headers.get('idempotency-replayed')).toBe('true');
    expect(runs).toBe(1);
  });

  it('a 5xx answer or a thrown error is not kept: the same key may be tried again', async () => {
    let attempt = 0;
    const flaky: Partial<Record<'POST', APIRoute>> = {
      POST: () => {
        attempt += 1;
        if (attempt === 1) return Promise.resolve(json({ error: { code: 'internal' } }, 503));
        if (attempt === 2) throw new Error('disk went away');
        return Promise.resolve(json({ ok: attempt }, 201));
      },
    };
    const key = randomUUID();
    const opts = { session: s.member, path: '/api/flaky-write', headers: { 'Idempotency-Key': key }, body: {} };
    expect((await call(flaky, 'POST', opts)).status).toBe(503);
    await expect(call(flaky, 'POST', opts)).rejects.toThrow('disk went away');
    const third = await call(flaky, 'POST', opts);
    expect(third.status).toBe(201);
    expect(third.body).toEqual({ ok: 3 });
    const fourth = await call(flaky, 'POST', opts);
    expect(fourth.body).toEqual({ ok: 3 });
    expect(attempt).toBe(3);
  });

  it('keys older than a day are pruned; signed-out writes and reads ignore the header', async () => {
    const key = randomUUID();
    expect((await post('Pruned key lesson', key)).status).toBe(201);
    const row = () => db().select().from(idempotencyKeys).where(eq(idempotencyKeys.key, key)).get();
    expect(row()).toBeDefined();
    expect(pruneOldKeys(Date.now())).toBeGreaterThanOrEqual(0);
    expect(row()).toBeDefined();
    pruneOldKeys(Date.now() + KEEP_MS + 1000);
    expect(row()).toBeUndefined();
    // After pruning the key is free again (the day has passed).
    expect((await post('Pruned key lesson', key)).status).toBe(201);

    const signedOut = await call(recordsRoute, 'POST', {
      path: RECORDS,
      body: lesson('x'),
      headers: { 'Idempotency-Key': 'not valid!' },
    });
    expect(signedOut.status).toBe(401);
    const read = await call(recordsRoute, 'GET', {
      session: s.member,
      path: RECORDS,
      headers: { 'Idempotency-Key': 'not valid!' },
    });
    expect(read.status).toBe(200);
  });
});
