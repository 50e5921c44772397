// Review before acceptance (issue 13, section 2): who may accept, what a review unlocks, what supersedes what.
import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as status from '../../src/pages/api/records/[id]/status';
import * as review from '../../src/pages/api/records/[id]/review';
import { templateFor } from '../../src/lib/editor/templates';
import { listAwaitingReview } from '../../src/lib/server/records/list';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

async function create(extra: object = {}) {
  const res = await call(recordsRoute, 'POST', {
    session: s.member,
    body: {
      kind: 'decision',
      title: 'Fuse the solar strings at 15 A',
      subsystem: 'solar',
      body: templateFor('decision'),
      ...extra,
    },
  });
  expect(res.status, res.text).toBe(201);
  return res.body.record as { id: string; version: number };
}
const move = (role: DemoRole, id: string, to: string, extra: object = {}) =>
  call(status, 'POST', { session: s[role], params: { id }, body: { status: to, ...extra } });
async function proposed() {
  const r = await create();
  expect((await move('member', r.id, 'proposed')).status).toBe(200);
  return r;
}

describe('accepting a decision', () => {
  it('a member alone gets 409 with a sentence saying a review is needed', async () => {
    const r = await proposed();
    const res = await move('member', r.id, 'accepted');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.message).toMatch(/needs a review/);
    const still = await call(recordRoute, 'GET', { session: s.member, params: { id: r.id } });
    expect(still.body.record.status).toBe('proposed');
  });

  it('once an advisor has reviewed the current version, the member may accept it', async () => {
    const r = await proposed();
    expect((await call(review, 'POST', { session: s.advisor, params: { id: r.id }, body: {} })).status).toBe(200);
    const res = await move('member', r.id, 'accepted');
    expect(res.status, res.text).toBe(200);
    expect(res.body.record.status).toBe('accepted');
  });

  it('a review of an earlier version does not count after the text changed', async () => {
    const r = await proposed();
    await call(review, 'POST', { session: s.lead, params: { id: r.id }, body: {} });
    const edit = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 2, title: 'Fuse the solar strings at 20 A' },
    });
    expect(edit.status).toBe(200);
    expect(edit.body.record.reviewed.current).toBe(false);
    expect((await move('member', r.id, 'accepted')).status).toBe(409);
  });

  it('a review of a draft still holds once it is proposed: a status change leaves the text as it was', async () => {
    const r = await create();
    await call(review, 'POST', { session: s.advisor, params: { id: r.id }, body: {} });
    const p = await move('member', r.id, 'proposed');
    expect(p.body.record.reviewed).toMatchObject({ current: true, version: 2 });
    expect((await move('member', r.id, 'accepted')).status).toBe(200);
  });

  it('advisors and leads accept without a separate review; advisors withdraw but cannot propose or edit', async () => {
    const a = await proposed();
    expect((await move('advisor', a.id, 'accepted')).status).toBe(200);
    expect((await move('advisor', a.id, 'withdrawn')).body.record.status).toBe('withdrawn');
    const b = await proposed();
    expect((await move('lead', b.id, 'accepted')).status).toBe(200);

    const draft = await create();
    expect((await move('advisor', draft.id, 'proposed')).status).toBe(403);
    const edit = await call(recordRoute, 'PATCH', {
      session: s.advisor,
      params: { id: draft.id },
      body: { version: 1, title: 'An advisor rewrites it' },
    });
    expect(edit.status).toBe(403);
    for (const role of ['alumni'] as const) expect((await move(role, draft.id, 'proposed')).status).toBe(403);
  });

  it('lessons are addressed without a review', async () => {
    const l = await create({ kind: 'lesson', source: 'testing', body: templateFor('lesson') });
    expect((await move('member', l.id, 'addressed')).status).toBe(200);
  });
});

describe('superseding', () => {
  it('only an accepted decision replaces one: a proposed one is refused on supersededBy', async () => {
    const old = await proposed();
    await move('advisor', old.id, 'accepted');
    const newer = await proposed();
    const early = await move('member', old.id, 'superseded', { supersededBy: newer.id });
    expect(early.status).toBe(400);
    expect(early.body.error.issues[0]).toMatchObject({ path: 'supersededBy' });
    expect(early.body.error.issues[0].message).toMatch(/only by an accepted one/);
    await move('advisor', newer.id, 'accepted');
    const ok = await move('member', old.id, 'superseded', { supersededBy: newer.id });
    expect(ok.status, ok.text).toBe(200);
    // Advisors accept and withdraw; replacing one decision with another stays with its writers and leads.
    const third = await proposed();
    await move('lead', third.id, 'accepted');
    expect((await move('advisor', newer.id, 'superseded', { supersededBy: third.id })).status).toBe(403);
  });
});

describe('the review queue', () => {
  it('lists proposed decisions whose current version is unreviewed, longest waiting first; a review takes one off', async () => {
    const before = listAwaitingReview(100).map((r) => r.id);
    // The demo: the throttle ramp waits for a review; the dashboard target was reviewed already.
    expect(before).toContain('demo-rec-2526-throttle-soft-start');
    expect(before).not.toContain('demo-rec-2526-dashboard-power-target');
    const r = await proposed();
    const draft = await create();
    const queued = listAwaitingReview(100).map((x) => x.id);
    expect(queued).toContain(r.id);
    expect(queued).not.toContain(draft.id);
    expect(queued.indexOf('demo-rec-2526-throttle-soft-start')).toBeLessThan(queued.indexOf(r.id));
    await call(review, 'POST', { session: s.advisor, params: { id: r.id }, body: {} });
    expect(listAwaitingReview(100).map((x) => x.id)).not.toContain(r.id);
    // An edit after the review puts it back, marked as reviewed earlier.
    await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 2, title: 'Fuse at 16 A' },
    });
    expect(listAwaitingReview(100).find((x) => x.id === r.id)).toMatchObject({ reviewedEarlier: true });
  });
});
