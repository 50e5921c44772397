// The response cache may only ever answer with what a fresh render would give: per person, per URL, and never
// after any write. These checks go through the real middleware and routes.
import { describe, it, expect, beforeAll, beforeEach, afterEach, vi } from 'vitest';
import Database from 'better-sqlite3';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as calculationRoute from '../../src/pages/api/calculations/[id]/index';
import * as me from '../../src/pages/api/me';
import { db } from '../../src/lib/server/db/client';
import { settings } from '../../src/lib/server/config';
import { cacheStats, clearResponseCache, MAX_AGE_MS } from '../../src/lib/server/response-cache';
import { memoUntilWrite } from '../../src/lib/server/memo';

let s: Record<DemoRole, string>;
const ID = 'demo-rec-2526-two-propellers';
const path = `/api/records/${ID}`;
const CALC = 'demo-calc-prop-sprint-2526';
const calcPath = `/api/calculations/${CALC}`;
const readRecord = (role: DemoRole, headers: Record<string, string> = {}) =>
  call(recordRoute, 'GET', { session: s[role], params: { id: ID }, path, headers });
const readCalc = (role: DemoRole) =>
  call(calculationRoute, 'GET', { session: s[role], params: { id: CALC }, path: calcPath });

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});
beforeEach(() => clearResponseCache());
afterEach(() => vi.useRealTimers());

describe('response cache', () => {
  it('answers a repeated read from the cache, byte for byte the same as the render, with its ETag', async () => {
    const first = await readRecord('member');
    const hits = cacheStats().hits;
    const second = await readRecord('member');
    expect(second.status).toBe(200);
    expect(cacheStats().hits).toBe(hits + 1);
    expect(second.text).toBe(first.text);
    expect(second.headers.get('etag')).toBe(first.headers.get('etag'));
    expect(first.headers.get('cache-control')).toBe('private, no-cache');
    expect(first.headers.get('etag')).toMatch(/^"[\w-]+"$/);
    expect(second.headers.get('content-security-policy')).toBe(first.headers.get('content-security-policy'));
  });

  it('any write, to any table, makes the next read render again', async () => {
    await readRecord('member');
    await readCalc('member');
    // A comment on the record: the record's answer must show the new count.
    const posted = await call(commentsRoute, 'POST', { session: s.lead, params: { id: ID }, body: { body: 'Seen?' } });
    expect(posted.status).toBe(201);
    const hits = cacheStats().hits;
    const after = await readRecord('member');
    expect(after.body.record.commentCount).toBeGreaterThan(0);
    // The calculation read nothing the comment wrote, but one generation for everything is the rule.
    await readCalc('member');
    expect(cacheStats().hits).toBe(hits);
  });

  it('a foreign-key cascade and a write by another connection both count as writes', async () => {
    await readRecord('member');
    // A copy of the record with a comment of its own; deleting the copy removes the comment by cascade only.
    const sqlite = db().$client;
    sqlite
      .prepare(
        "insert into records select 'tmp-r', kind, title, subsystem_slug, season_id, status, source, author_id, body, body_html, body_text, version, created_at, updated_at, updated_by_id, reviewed_by_id, reviewed_at, reviewed_version, review_note, deleted_at from records where id = ?",
      )
      .run(ID);
    sqlite
      .prepare(
        "insert into comments (id, record_id, author_id, body, created_at) values ('tmp-c', 'tmp-r', null, 'x', 0)",
      )
      .run();
    await readRecord('member');
    const hits = cacheStats().hits;
    sqlite.prepare("delete from records where id = 'tmp-r'").run();
    expect(sqlite.prepare("select count(*) from comments where id = 'tmp-c'").pluck().get()).toBe(0);
    await readRecord('member');
    expect(cacheStats().hits).toBe(hits);
    // Another process (a second connection to the same file) writes: data_version moves.
    const other = new Database(settings().WAKEBOOK_DB);
    other.prepare("update users set name = name || '.' where role = 'lead'").run();
    other.close();
    await readRecord('member');
    expect(cacheStats().hits).toBe(hits);
    await readRecord('member');
    expect(cacheStats().hits).toBe(hits + 1);
  });

  it('never answers one person with what was rendered for another, nor one URL with another', async () => {
    await readRecord('member');
    const hits = cacheStats().hits;
    const lead = await readRecord('lead');
    expect(lead.status).toBe(200);
    expect(cacheStats().hits).toBe(hits);
    await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path: `${path}?view=2` });
    expect(cacheStats().hits).toBe(hits);
  });

  it('a repeat with If-None-Match and nothing written answers 304 with no body', async () => {
    const first = await readRecord('member');
    const etag = first.headers.get('etag')!;
    const again = await readRecord('member', { 'if-none-match': etag });
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    expect(again.headers.get('etag')).toBe(etag);
    // A browser keeps the 304's headers for the page it already holds: the policy must be the page's own.
    expect(again.headers.get('content-security-policy')).toBe(first.headers.get('content-security-policy'));
    // With the cache emptied (or off) the render runs, and the same bytes still give 304.
    clearResponseCache();
    expect((await readRecord('member', { 'if-none-match': `W/${etag}` })).status).toBe(304);
    // After a write that changes the answer, the old tag no longer matches.
    await call(commentsRoute, 'POST', { session: s.lead, params: { id: ID }, body: { body: 'Changed.' } });
    const changed = await readRecord('member', { 'if-none-match': etag });
    expect(changed.status).toBe(200);
    expect(changed.headers.get('etag')).not.toBe(etag);
  });

  it('only signed-in GETs of routes that opt in are kept; refusals are never kept', async () => {
    const stores = cacheStats().stores;
    const mine = await call(me, 'GET', { session: s.member, path: '/api/me' });
    expect(mine.headers.get('etag')).toBeNull();
    const missing = await call(recordRoute, 'GET', {
      session: s.member,
      params: { id: 'no-such-record' },
      path: '/api/records/no-such-record',
    });
    expect(missing.status).toBe(404);
    expect((await call(recordRoute, 'GET', { params: { id: ID }, path })).status).toBe(401);
    expect(cacheStats().stores).toBe(stores);
  });

  it('entries expire after MAX_AGE_MS even without a write', async () => {
    vi.useFakeTimers({ toFake: ['Date', 'performance'] });
    clearResponseCache();
    await readRecord('member');
    const hits = cacheStats().hits;
    vi.advanceTimersByTime(MAX_AGE_MS / 2);
    await readRecord('member');
    expect(cacheStats().hits).toBe(hits + 1);
    vi.advanceTimersByTime(MAX_AGE_MS + 1);
    await readRecord('member');
    expect(cacheStats().hits).toBe(hits + 1);
  });

  it('never keeps a Set-Cookie header', async () => {
    await readRecord('member');
    const again = await readRecord('member');
    expect(again.headers.get('set-cookie')).toBeNull();
  });
});

describe('memoUntilWrite', () => {
  it('computes once until anything is written', () => {
    let runs = 0;
    const compute = () => ++runs;
    expect(memoUntilWrite('test.memo', compute)).toBe(1);
    expect(memoUntilWrite('test.memo', compute)).toBe(1);
    db().$client.prepare("update seasons set name = name || '.' where id = (select id from seasons limit 1)").run();
    expect(memoUntilWrite('test.memo', compute)).toBe(2);
    expect(memoUntilWrite('test.memo', compute)).toBe(2);
  });

  it('does not keep a value whose computation wrote', () => {
    let runs = 0;
    const writes = () => {
      db().$client.prepare("update users set name = name || '.' where role = 'alumni'").run();
      return ++runs;
    };
    expect(memoUntilWrite('test.memo.writes', writes)).toBe(1);
    expect(memoUntilWrite('test.memo.writes', writes)).toBe(2);
  });
});
