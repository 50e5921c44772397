// The response cache may only ever answer with what a fresh render would give: per person, per URL, and
// never after a write. These checks go through the real middleware and routes.
import { describe, it, expect, beforeAll, beforeEach } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as me from '../../src/pages/api/me';
import { db } from '../../src/lib/server/db/client';
import { currentVersions, dependencies } from '../../src/lib/server/db/changes';
import * as calculationRoute from '../../src/pages/api/calculations/[id]/index';
import {
  cacheKey,
  cached,
  cacheStats,
  clearResponseCache,
  MAX_AGE_MS,
  store,
} from '../../src/lib/server/response-cache';
import { memoUntilWrite } from '../../src/lib/server/memo';

let s: Record<DemoRole, string>;
const ID = 'demo-rec-2526-two-propellers';
const path = `/api/records/${ID}`;

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});
beforeEach(() => clearResponseCache());

describe('response cache', () => {
  it('answers a repeated read from the cache, byte for byte the same as the render', async () => {
    const first = await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    const before = cacheStats().hits;
    const second = await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    expect(second.status).toBe(200);
    expect(cacheStats().hits).toBe(before + 1);
    expect(second.text).toBe(first.text);
    expect(second.headers.get('content-security-policy')).toBe(first.headers.get('content-security-policy'));
  });

  it('a write anywhere makes the next read render again and show it', async () => {
    await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    const posted = await call(commentsRoute, 'POST', {
      session: s.lead,
      params: { id: ID },
      body: { body: 'Does the cache see this?' },
    });
    expect(posted.status).toBe(201);
    const hits = cacheStats().hits;
    const after = await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    expect(cacheStats().hits).toBe(hits);
    const comments = await call(commentsRoute, 'GET', {
      session: s.member,
      params: { id: ID },
      path: `${path}/comments`,
    });
    expect(after.body.record.commentCount).toBe(comments.body.comments.length);
    expect(comments.body.comments.map((c: { body: string }) => c.body)).toContain('Does the cache see this?');
  });

  it('never answers one person with what was rendered for another', async () => {
    const url = new URL(`http://localhost${path}`);
    const memberKey = cacheKey('GET', url, 'member-id')!;
    const version = dependencies(currentVersions(), ['users']);
    await store(memberKey, version, new Response('rendered for the member', { status: 200 }));
    expect(cached(memberKey)).not.toBeNull();
    expect(cached(cacheKey('GET', url, 'lead-id')!)).toBeNull();
    expect(cached(cacheKey('GET', new URL(`${url}?page=2`), 'member-id')!)).toBeNull();
  });

  it('only signed-in GETs are candidates, and a route that does not opt in is never stored', async () => {
    expect(cacheKey('POST', new URL('http://x/api/records'), 'u')).toBeNull();
    expect(cacheKey('GET', new URL('http://x/api/records'), undefined)).toBeNull();
    const stores = cacheStats().stores;
    await call(me, 'GET', { session: s.member, path: '/api/me' });
    expect(cacheStats().stores).toBe(stores);
  });

  it('refusals are not stored; the next allowed read is rendered for its own person', async () => {
    const missing = await call(recordRoute, 'GET', {
      session: s.member,
      params: { id: 'no-such-record' },
      path: '/api/records/no-such-record',
    });
    expect(missing.status).toBe(404);
    expect(cacheStats().entries).toBe(0);
    const signedOut = await call(recordRoute, 'GET', { params: { id: ID }, path });
    expect(signedOut.status).toBe(401);
  });

  it('entries expire after MAX_AGE_MS even without a write, and cookies are never stored', async () => {
    const key = 'user\u0000/x';
    const version = dependencies(currentVersions(), ['users']);
    const t0 = Date.now();
    const out = await store(
      key,
      version,
      new Response('hello', { status: 200, headers: { 'set-cookie': 'a=b', 'x-kept': '1' } }),
      t0,
    );
    expect(await out.text()).toBe('hello');
    const hit = cached(key, t0 + 1000);
    expect(hit && (await hit.text())).toBe('hello');
    expect(hit?.headers.get('set-cookie')).toBeNull();
    expect(hit?.headers.get('x-kept')).toBe('1');
    expect(cached(key, t0 + MAX_AGE_MS + 1)).toBeNull();
  });

  it('a 500 or a redirect is passed through but not kept', async () => {
    const version = dependencies(currentVersions(), ['users']);
    await store('k1', version, new Response('boom', { status: 500 }));
    await store('k2', version, new Response(null, { status: 302, headers: { location: '/' } }));
    expect(cached('k1')).toBeNull();
    expect(cached('k2')).toBeNull();
  });
});

describe('memoUntilWrite', () => {
  it('computes once until a table it read is written, and ignores writes elsewhere', () => {
    let runs = 0;
    const compute = () => {
      db().$client.prepare('select count(*) from seasons').get();
      return ++runs;
    };
    expect(memoUntilWrite('test.memo', compute)).toBe(1);
    expect(memoUntilWrite('test.memo', compute)).toBe(1);
    db().$client.prepare("update users set name = name || '' where role = 'lead'").run();
    expect(memoUntilWrite('test.memo', compute)).toBe(1);
    db().$client.prepare('update seasons set name = name').run();
    expect(memoUntilWrite('test.memo', compute)).toBe(2);
  });

  it('does not keep a value whose computation wrote to a table it read', () => {
    let runs = 0;
    const writes = () => {
      db().$client.prepare('select count(*) from users').get();
      db().$client.prepare('update users set name = name where 1 = 1').run();
      return ++runs;
    };
    expect(memoUntilWrite('test.memo.writes', writes)).toBe(1);
    expect(memoUntilWrite('test.memo.writes', writes)).toBe(2);
  });
});

describe('invalidation follows the tables an answer read', () => {
  const CALC = 'demo-calc-prop-sprint-2526';
  const calcPath = `/api/calculations/${CALC}`;

  it('a comment leaves a cached calculation standing but renders the record again with the new count', async () => {
    const calc1 = await call(calculationRoute, 'GET', { session: s.member, params: { id: CALC }, path: calcPath });
    const rec1 = await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    expect(calc1.status).toBe(200);
    const posted = await call(commentsRoute, 'POST', {
      session: s.lead,
      params: { id: ID },
      body: { body: 'Only the record changes.' },
    });
    expect(posted.status).toBe(201);
    const hits = cacheStats().hits;
    const calc2 = await call(calculationRoute, 'GET', { session: s.member, params: { id: CALC }, path: calcPath });
    expect(cacheStats().hits).toBe(hits + 1);
    expect(calc2.text).toBe(calc1.text);
    const rec2 = await call(recordRoute, 'GET', { session: s.member, params: { id: ID }, path });
    expect(cacheStats().hits).toBe(hits + 1);
    expect(rec2.body.record.commentCount).toBe(rec1.body.record.commentCount + 1);
  });

  it('a change to the person (name or role) renders their pages again', async () => {
    await call(calculationRoute, 'GET', { session: s.member, params: { id: CALC }, path: calcPath });
    db().$client.prepare("update users set name = name || '' where role = 'member'").run();
    const hits = cacheStats().hits;
    await call(calculationRoute, 'GET', { session: s.member, params: { id: CALC }, path: calcPath });
    expect(cacheStats().hits).toBe(hits);
  });
});
