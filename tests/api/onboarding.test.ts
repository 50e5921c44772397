import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as route from '../../src/pages/api/onboarding/[subsystem]/index';
import * as progress from '../../src/pages/api/onboarding/[subsystem]/progress';
import * as guides from '../../src/pages/api/guides/index';
import * as readiness from '../../src/pages/api/readiness';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('GET /api/guides', () => {
  it('lists the curated guides with reviewer and date; filters by subsystem', async () => {
    expect((await call(guides, 'GET')).status).toBe(401);
    const all = await call(guides, 'GET', { session: s.alumni });
    expect(all.status).toBe(200);
    expect(all.body.guides.length).toBeGreaterThanOrEqual(10);
    expect(new Set(all.body.guides.map((g: { subsystem: string }) => g.subsystem)).size).toBeGreaterThanOrEqual(6);
    for (const g of all.body.guides)
      expect(g).toMatchObject({
        slug: expect.any(String),
        title: expect.any(String),
        url: `/guides/${g.slug}`,
        reviewedBy: expect.any(String),
        reviewedOn: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/),
      });
    const prop = await call(guides, 'GET', { session: s.alumni, query: { subsystem: 'propulsion' } });
    expect(prop.body.guides.every((g: { subsystem: string }) => g.subsystem === 'propulsion')).toBe(true);
    expect((await call(guides, 'GET', { session: s.alumni, query: { subsystem: '../etc' } })).status).toBe(400);
  });
});

describe('onboarding routes', () => {
  it('every demo route item exists (guides, records and calculations)', async () => {
    for (const slug of ['propulsion', 'cooling', 'battery', 'hull', 'solar', 'steering', 'telemetry']) {
      const r = await call(route, 'GET', { session: s.member, params: { subsystem: slug } });
      expect(r.status).toBe(200);
      expect(r.body.items.length).toBeGreaterThan(0);
      expect(r.body.items.every((i: { exists: boolean }) => i.exists)).toBe(true);
    }
  });

  it('shows the caller’s own progress and lets them tick items off and back', async () => {
    const r = await call(route, 'GET', { session: s.member, params: { subsystem: 'propulsion' } });
    expect(r.body.progress).toEqual({ done: 3, total: 8 });
    const next = r.body.items.find((i: { done: boolean }) => !i.done);
    const tick = await call(progress, 'POST', {
      session: s.member,
      params: { subsystem: 'propulsion' },
      body: { itemId: next.id, done: true },
    });
    expect(tick.status).toBe(200);
    expect(tick.body).toEqual({ done: 4, total: 8 });
    const untick = await call(progress, 'POST', {
      session: s.member,
      params: { subsystem: 'propulsion' },
      body: { itemId: next.id, done: false },
    });
    expect(untick.body).toEqual({ done: 3, total: 8 });
    const other = await call(route, 'GET', { session: s.alumni, params: { subsystem: 'propulsion' } });
    expect(other.body.progress.done).toBe(0);
    expect(
      (
        await call(progress, 'POST', {
          session: s.member,
          params: { subsystem: 'propulsion' },
          body: { itemId: 'nope', done: true },
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await call(progress, 'POST', {
          session: s.member,
          params: { subsystem: 'cooling' },
          body: { itemId: next.id, done: true },
        })
      ).status,
    ).toBe(404);
  });

  it('advisors reorder a route; ticks survive the reorder', async () => {
    const before = (await call(route, 'GET', { session: s.member, params: { subsystem: 'propulsion' } })).body;
    const reversed = [...before.items]
      .reverse()
      .map((i: { kind: string; ref: string }) => ({ kind: i.kind, ref: i.ref }));
    const put = await call(route, 'PUT', {
      session: s.advisor,
      params: { subsystem: 'propulsion' },
      body: { items: reversed },
    });
    expect(put.status).toBe(200);
    const after = (await call(route, 'GET', { session: s.member, params: { subsystem: 'propulsion' } })).body;
    expect(after.items.map((i: { ref: string }) => i.ref)).toEqual(reversed.map((i) => i.ref));
    expect(after.progress).toEqual(before.progress);
  });

  it('refuses items that do not exist (400 naming each) and duplicates; members and alumni may not curate (403)', async () => {
    const bad = await call(route, 'PUT', {
      session: s.lead,
      params: { subsystem: 'hull' },
      body: {
        items: [
          { kind: 'guide', ref: 'hull-resistance-in-plain-terms' },
          { kind: 'record', ref: 'no-such-record' },
          { kind: 'guide', ref: 'hull-resistance-in-plain-terms' },
        ],
      },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['items.1.ref', 'items.2.ref']);
    for (const role of ['member', 'alumni'] as const) {
      expect(
        (await call(route, 'PUT', { session: s[role], params: { subsystem: 'hull' }, body: { items: [] } })).status,
      ).toBe(403);
    }
    expect((await call(route, 'GET', { session: s.member, params: { subsystem: 'rigging' } })).status).toBe(404);
  });
});

describe('GET /api/readiness', () => {
  it('scores each subsystem 0–100 with what is missing, and the scores differ', async () => {
    const r = await call(readiness, 'GET', { session: s.alumni });
    expect(r.status).toBe(200);
    expect(r.body.season.current).toBe(true);
    expect(r.body.subsystems).toHaveLength(7);
    for (const x of r.body.subsystems) {
      expect(x.score).toBeGreaterThanOrEqual(0);
      expect(x.score).toBeLessThanOrEqual(100);
      expect(Array.isArray(x.missing)).toBe(true);
      if (x.score < 100) expect(x.missing.length).toBeGreaterThan(0);
    }
    expect(new Set(r.body.subsystems.map((x: { score: number }) => x.score)).size).toBeGreaterThan(2);
    expect((await call(readiness, 'GET', { session: s.alumni, query: { season: 'nope' } })).status).toBe(404);
    expect((await call(readiness, 'GET')).status).toBe(401);
  });
});
