import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as guides from '../../src/pages/api/guides/index';
import * as review from '../../src/pages/api/guides/[slug]/review';
import * as suggestions from '../../src/pages/api/guides/[slug]/suggestions';
import * as suggestion from '../../src/pages/api/guides/suggestions/[id]';
import * as readiness from '../../src/pages/api/readiness';
import { db } from '../../src/lib/server/db/client';
import { guideReviews } from '../../src/lib/server/db/schema';
import { openSuggestionsForMaintainers } from '../../src/lib/server/guide-suggestions';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type G = { slug: string; reviewedBy: string; reviewedOn: string; reviewStale: boolean };
const guide = async (slug: string): Promise<G> =>
  (await call(guides, 'GET', { session: s.member })).body.guides.find((g: G) => g.slug === slug);

// Steering's guide file says it was reviewed on 2025-03-14 (stale); the handover checklist's on 2026-11-16.
const STALE = 'steering-and-driver-controls';
const FRESH = 'handover-checklist';

describe('guide reviews from the app', () => {
  it('an app review older than the file’s keeps the file’s reviewer and date (the later one wins)', async () => {
    db()
      .insert(guideReviews)
      .values({ id: 'old-review', guideSlug: FRESH, reviewerId: null, note: 'old', createdAt: new Date('2024-01-02') })
      .run();
    expect(await guide(FRESH)).toMatchObject({ reviewedBy: 'Ruth Calloway', reviewedOn: '2026-11-16' });
  });

  it('an advisor marks a stale guide reviewed with a note → 201; the list, the stale flag and readiness follow', async () => {
    const before = await guide(STALE);
    expect(before).toMatchObject({ reviewedOn: '2025-03-14', reviewStale: true });
    const readinessBefore = (await call(readiness, 'GET', { session: s.member })).body.subsystems.find(
      (x: { slug: string }) => x.slug === 'steering',
    );
    expect(readinessBefore.has.guidesReviewed).toBe(0);

    const res = await call(review, 'POST', {
      session: s.advisor,
      params: { slug: STALE },
      body: { note: 'Checked against this year’s rudder and the race rules.' },
    });
    expect(res.status).toBe(201);
    const today = new Date().toISOString().slice(0, 10);
    expect(res.body.guide).toMatchObject({ reviewedOn: today, reviewSource: 'app', reviewStale: false });
    const after = await guide(STALE);
    expect(after.reviewedOn).toBe(today);
    expect(after.reviewedBy).toBe(res.body.guide.reviewedBy);
    expect(after.reviewedBy).not.toBe('Ruth Calloway');
    expect(after.reviewStale).toBe(false);
    const readinessAfter = (await call(readiness, 'GET', { session: s.member })).body.subsystems.find(
      (x: { slug: string }) => x.slug === 'steering',
    );
    expect(readinessAfter.has.guidesReviewed).toBe(1);
  });

  it('members and alumni may not review (403); an unknown guide is 404; a long note is 400', async () => {
    for (const role of ['member', 'alumni'] as const)
      expect((await call(review, 'POST', { session: s[role], params: { slug: STALE }, body: {} })).status).toBe(403);
    expect((await call(review, 'POST', { session: s.lead, params: { slug: 'nope' }, body: {} })).status).toBe(404);
    const long = await call(review, 'POST', {
      session: s.lead,
      params: { slug: STALE },
      body: { note: 'x'.repeat(1001) },
    });
    expect(long.status).toBe(400);
    expect(long.body.error.issues[0].path).toBe('note');
  });
});

describe('suggested changes to a guide', () => {
  let id = '';
  it('anyone signed in suggests a change for one of the guide’s sections → 201', async () => {
    const res = await call(suggestions, 'POST', {
      session: s.alumni,
      params: { slug: FRESH },
      body: { section: 'Safety', body: 'Add the lock-out tag for the main contactor.' },
    });
    expect(res.status).toBe(201);
    expect(res.body.suggestion).toMatchObject({ state: 'open', section: 'Safety', guideSlug: FRESH });
    id = res.body.suggestion.id;
    const whole = await call(suggestions, 'POST', {
      session: s.member,
      params: { slug: FRESH },
      body: { body: 'A printable one-page version would help.' },
    });
    expect(whole.status).toBe(201);
    expect(whole.body.suggestion.section).toBeNull();
  });

  it('refuses a section the guide does not have, an empty text, and unknown guides', async () => {
    const bad = await call(suggestions, 'POST', {
      session: s.member,
      params: { slug: FRESH },
      body: { section: 'No such heading', body: 'x' },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('section');
    const empty = await call(suggestions, 'POST', { session: s.member, params: { slug: FRESH }, body: { body: '  ' } });
    expect(empty.status).toBe(400);
    expect(empty.body.error.issues[0].path).toBe('body');
    expect(
      (await call(suggestions, 'POST', { session: s.member, params: { slug: 'nope' }, body: { body: 'x' } })).status,
    ).toBe(404);
    expect((await call(suggestions, 'POST', { params: { slug: FRESH }, body: { body: 'x' } })).status).toBe(401);
  });

  it('advisors and leads list them by state; members and alumni may not (403)', async () => {
    const open = await call(suggestions, 'GET', {
      session: s.advisor,
      params: { slug: FRESH },
      query: { state: 'open' },
    });
    expect(open.status).toBe(200);
    expect(open.body.suggestions).toHaveLength(2);
    expect(open.body.suggestions.find((x: { id: string }) => x.id === id).author).toEqual(expect.any(String));
    for (const role of ['member', 'alumni'] as const)
      expect((await call(suggestions, 'GET', { session: s[role], params: { slug: FRESH } })).status).toBe(403);
    expect(
      (await call(suggestions, 'GET', { session: s.lead, params: { slug: FRESH }, query: { state: 'maybe' } })).status,
    ).toBe(400);
  });

  it('an advisor marks one done: it leaves the open list and the maintainer’s view, and carries who decided', async () => {
    for (const role of ['member', 'alumni'] as const)
      expect(
        (await call(suggestion, 'PATCH', { session: s[role], params: { id }, body: { state: 'done' } })).status,
      ).toBe(403);
    const done = await call(suggestion, 'PATCH', { session: s.advisor, params: { id }, body: { state: 'done' } });
    expect(done.status).toBe(200);
    expect(done.body.suggestion).toMatchObject({ state: 'done', decidedBy: expect.any(String) });
    expect(done.body.suggestion.decidedAt).toMatch(/^\d{4}-/);
    const open = await call(suggestions, 'GET', { session: s.lead, params: { slug: FRESH }, query: { state: 'open' } });
    expect(open.body.suggestions.map((x: { id: string }) => x.id)).not.toContain(id);
    const doneList = await call(suggestions, 'GET', {
      session: s.lead,
      params: { slug: FRESH },
      query: { state: 'done' },
    });
    expect(doneList.body.suggestions.map((x: { id: string }) => x.id)).toEqual([id]);
    const maintainers = await openSuggestionsForMaintainers();
    expect(maintainers).toHaveLength(1);
    expect(maintainers[0]).toMatchObject({
      guideSlug: FRESH,
      filePath: 'src/content/guides/general/handover-checklist.mdx',
      guideTitle: 'Handover checklist for an outgoing cohort',
    });
    const declined = await call(suggestion, 'PATCH', { session: s.lead, params: { id }, body: { state: 'declined' } });
    expect(declined.body.suggestion.state).toBe('declined');
    expect((await call(suggestion, 'PATCH', { session: s.lead, params: { id }, body: { state: 'gone' } })).status).toBe(
      400,
    );
    expect(
      (await call(suggestion, 'PATCH', { session: s.lead, params: { id: 'nope' }, body: { state: 'done' } })).status,
    ).toBe(404);
  });
});
