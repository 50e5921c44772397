// GET /api/offline/pack (issue 16): what a person's browser keeps for reading offline, whole or since a version.
import { describe, it, expect, beforeAll } from 'vitest';
import { and, inArray, isNull } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as pack from '../../src/pages/api/offline/pack';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as guidesRoute from '../../src/pages/api/guides/index';
import { db } from '../../src/lib/server/db/client';
import { records } from '../../src/lib/server/db/schema';
import { calculatorKinds } from '../../src/lib/calc';
import { templateFor } from '../../src/lib/editor/templates';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const ids = (items: { id: string }[]) => items.map((i) => i.id);
const get = (role: DemoRole, since?: string) =>
  call(pack, 'GET', { session: s[role], query: since === undefined ? {} : { since } });

describe('GET /api/offline/pack', () => {
  it('asks for a session', async () => {
    const res = await call(pack, 'GET');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it("gives a member their subsystems' records and lessons in every season, and no one else's", async () => {
    const res = await get('member');
    expect(res.status, res.text).toBe(200);
    expect(res.headers.get('cache-control')).toBe('no-store');
    const p = res.body;
    expect(p.version).toMatch(/^\d+-[0-9a-f]{8}$/);
    expect(p.full).toBe(true);
    // The demo member owns propulsion and cooling in 2025–26.
    expect(p.scope).toEqual({ rule: 'memberships', subsystems: ['cooling', 'propulsion'] });
    const expected = db()
      .select({ id: records.id })
      .from(records)
      .where(and(inArray(records.subsystemSlug, ['cooling', 'propulsion']), isNull(records.deletedAt)))
      .all();
    expect(ids(p.records).sort()).toEqual(ids(expected).sort());
    expect(new Set(p.records.map((r: { season: string }) => r.season))).toEqual(
      new Set(['2023–24', '2024–25', '2025–26']),
    );
    expect(ids(p.records)).toContain('demo-rec-2324-compromise-propeller');
    expect(ids(p.records)).toContain('demo-rec-2526-closed-cooling-loop');
    expect(ids(p.records)).not.toContain('demo-rec-2526-throttle-soft-start'); // steering
    for (const r of p.records) {
      expect(['cooling', 'propulsion']).toContain(r.subsystem);
      expect(r.url).toBe(`/records/${r.id}`);
      expect(Date.parse(r.updatedAt)).not.toBeNaN();
    }
  });

  it('holds every guide, the calculations of those subsystems, the calculators and the onboarding routes', async () => {
    const p = (await get('member')).body;
    const guides = (await call(guidesRoute, 'GET', { session: s.member })).body.guides;
    expect(p.guides.map((g: { slug: string }) => g.slug).sort()).toEqual(
      guides.map((g: { slug: string }) => g.slug).sort(),
    );
    for (const g of p.guides) expect(g).toMatchObject({ url: `/guides/${g.slug}`, title: expect.any(String) });

    expect(ids(p.calculations)).toEqual(
      expect.arrayContaining([
        'demo-calc-prop-endurance-2526',
        'demo-calc-cooling-2425',
        'demo-calc-prop-endurance-2425',
      ]),
    );
    expect(ids(p.calculations)).not.toContain('demo-calc-resistance-2526'); // hull
    for (const c of p.calculations) {
      expect(['cooling', 'propulsion']).toContain(c.subsystem);
      expect(c.url).toBe(`/calculations/${c.id}`);
    }

    expect(p.calculators.map((c: { url: string }) => c.url).sort()).toEqual(
      calculatorKinds.map((k) => `/calculations/new/${k}`).sort(),
    );

    const propulsion = p.onboarding.find((o: { subsystem: string }) => o.subsystem === 'propulsion');
    expect(propulsion).toMatchObject({ url: '/subsystems/propulsion', progress: { done: 3, total: 8 } });
    expect(propulsion.items.filter((i: { done: boolean }) => i.done)).toHaveLength(3);
    expect(p.onboarding.map((o: { subsystem: string }) => o.subsystem).sort()).toEqual(['cooling', 'propulsion']);
  });

  it('gives a lead every subsystem', async () => {
    const p = (await get('lead')).body;
    expect(p.scope.rule).toBe('all');
    expect(ids(p.records)).toContain('demo-rec-2526-throttle-soft-start');
    expect(ids(p.calculations)).toContain('demo-calc-resistance-2526');
  });

  it('with ?since= answers only what changed, and the drafts discarded since', async () => {
    const first = (await get('member')).body;
    const nothing = (await get('member', first.version)).body;
    expect(nothing.full).toBe(false);
    expect(nothing.records).toEqual([]);
    expect(nothing.calculations).toEqual([]);
    expect(nothing.calculators).toEqual([]);
    expect(nothing.removed).toEqual([]);

    // A new draft in cooling, a question on a propulsion record, an edit outside the member's subsystems.
    const draft = await call(recordsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'decision',
        title: 'Bleed the cooling loop before launch',
        status: 'draft',
        subsystem: 'cooling',
        body: templateFor('decision'),
      },
    });
    expect(draft.status, draft.text).toBe(201);
    const asked = await call(commentsRoute, 'POST', {
      session: s.member,
      params: { id: 'demo-rec-2526-two-propellers' },
      body: { body: 'Which pitch did the sprint propeller end up with?', kind: 'question' },
    });
    expect(asked.status, asked.text).toBe(201);
    const steering = (
      await call(recordRoute, 'GET', { session: s.lead, params: { id: 'demo-rec-2526-throttle-soft-start' } })
    ).body.record;
    const edited = await call(recordRoute, 'PATCH', {
      session: s.lead,
      params: { id: steering.id },
      body: { version: steering.version, title: `${steering.title} (checked)` },
    });
    expect(edited.status, edited.text).toBe(200);

    const changes = (await get('member', first.version)).body;
    expect(changes.full).toBe(false);
    expect(ids(changes.records).sort()).toEqual([draft.body.record.id, 'demo-rec-2526-two-propellers'].sort());
    expect(changes.calculations).toEqual([]);
    expect(changes.guides.length).toBeLessThan(first.guides.length);

    // Discarding the draft: it leaves the pack and is named among the removals.
    const second = changes.version;
    expect(
      (await call(recordRoute, 'DELETE', { session: s.member, params: { id: draft.body.record.id } })).status,
    ).toBe(204);
    const after = (await get('member', second)).body;
    expect(after.removed).toContainEqual({ id: draft.body.record.id, url: `/records/${draft.body.record.id}` });
    expect(ids(after.records)).not.toContain(draft.body.record.id);
    expect(ids((await get('member')).body.records)).not.toContain(draft.body.record.id);
  });

  it('answers the whole pack again for a version of another scope, and refuses a made-up one', async () => {
    const lead = (await get('lead')).body;
    const other = (await get('member', lead.version)).body;
    expect(other.full).toBe(true);
    expect(other.records.length).toBeGreaterThan(0);

    for (const since of ['yesterday', '12', '1767225600000-XYZ', `${'9'.repeat(16)}-1a2b3c4d`]) {
      const bad = await get('member', since);
      expect(bad.status, since).toBe(400);
      expect(bad.body.error.code).toBe('invalid_input');
      expect(bad.body.error.issues[0].path).toBe('since');
    }
  });
});
