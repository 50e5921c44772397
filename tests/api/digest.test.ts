import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { newId } from '../../src/lib/server/ids';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, demoAccounts, type DemoRole } from '../setup/db';
import { latestMailTo, mailCountTo } from '../setup/mail';
import * as digest from '../../src/pages/api/digest/send';
import * as me from '../../src/pages/api/me';
import * as comments from '../../src/pages/api/records/[id]/comments';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as audit from '../../src/pages/api/audit';
import { db } from '../../src/lib/server/db/client';
import { onboardingItems, onboardingProgress, users } from '../../src/lib/server/db/schema';
import { resetSettingsForTests } from '../../src/lib/server/config';
import { buildDigest } from '../../src/lib/server/digest/build';
import { sendDigests } from '../../src/lib/server/digest/send';

const CRON = 'c'.repeat(40);
let s: Record<DemoRole, string>;
let memberId = '';
let itemId = '';

beforeAll(async () => {
  process.env.WAKEBOOK_CRON_TOKEN = CRON;
  resetSettingsForTests();
  await seedDemo();
  s = await sessionsForAllRoles();
  memberId = db().select().from(users).where(eq(users.email, demoAccounts.member)).get()!.id;
  // This week: a new lesson, a question on the member's own record, and an onboarding step in their subsystem.
  const lesson = await call(recordsRoute, 'POST', {
    session: s.lead,
    body: {
      kind: 'lesson',
      title: 'The trailer strap chafed through on the motorway',
      subsystem: 'hull',
      source: 'organising',
      body: {
        type: 'doc',
        content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Use edge protectors.' }] }],
      },
    },
  });
  expect(lesson.status).toBe(201);
  const q = await call(comments, 'POST', {
    session: s.alumni,
    params: { id: 'demo-rec-2526-closed-cooling-loop' },
    body: { body: 'Did you flush the loop before filling with glycol?' },
  });
  expect(q.status).toBe(201);
  // The demo may already route newcomers through this record; either way there is exactly one such step.
  db()
    .insert(onboardingItems)
    .values({
      id: newId(),
      subsystemSlug: 'cooling',
      position: 99,
      kind: 'record',
      ref: 'demo-rec-2526-closed-cooling-loop',
      createdAt: new Date(),
    })
    .onConflictDoNothing()
    .run();
  itemId = db()
    .select()
    .from(onboardingItems)
    .where(
      and(eq(onboardingItems.subsystemSlug, 'cooling'), eq(onboardingItems.ref, 'demo-rec-2526-closed-cooling-loop')),
    )
    .get()!.id;
  db()
    .delete(onboardingProgress)
    .where(and(eq(onboardingProgress.userId, memberId), eq(onboardingProgress.itemId, itemId)))
    .run();
});

afterAll(() => {
  delete process.env.WAKEBOOK_CRON_TOKEN;
  resetSettingsForTests();
});

describe('the digest', () => {
  it('builds new records, lessons, comments on their records and unfinished onboarding steps', async () => {
    const d = await buildDigest(memberId, new Date(Date.now() - 7 * 24 * 3600 * 1000), 'https://wakebook.example');
    const headings = d.sections.map((x) => x.heading);
    expect(headings).toEqual([
      'New lessons',
      'Questions and answers on your records',
      'Your unfinished onboarding steps',
    ]);
    expect(d.sections[0].items[0]).toMatchObject({ title: 'The trailer strap chafed through on the motorway' });
    expect(d.sections[0].items[0].url).toMatch(/^https:\/\/wakebook\.example\/records\//);
    expect(d.sections[1].items[0].note).toContain('flush the loop');
    const step = 'https://wakebook.example/records/demo-rec-2526-closed-cooling-loop';
    expect(d.sections[2].items.map((i) => i.url)).toContain(step);
    db().insert(onboardingProgress).values({ userId: memberId, itemId, doneAt: new Date() }).run();
    const after = await buildDigest(memberId, new Date(Date.now() - 7 * 24 * 3600 * 1000), 'https://wakebook.example');
    expect(
      (after.sections.find((x) => x.heading === 'Your unfinished onboarding steps')?.items ?? []).map((i) => i.url),
    ).not.toContain(step);
    db()
      .delete(onboardingProgress)
      .where(and(eq(onboardingProgress.userId, memberId), eq(onboardingProgress.itemId, itemId)))
      .run();
  });

  it('a lead sends it now: only to people who opted in, skipping those with nothing new, and it is audited', async () => {
    expect((await call(me, 'PATCH', { session: s.member, body: { digestOptIn: true } })).status).toBe(200);
    const res = await call(digest, 'POST', { session: s.lead, body: {} });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ recipients: 1, sent: 1, failed: 0, skipped: 0 });
    const mail = latestMailTo(demoAccounts.member);
    expect(mail.subject).toMatch(/^Wakebook: your week since \d{4}-\d{2}-\d{2}$/);
    expect(mail.text).toContain('The trailer strap chafed through on the motorway');
    expect(mail.text).toContain('Questions and answers on your records');
    expect(mail.html).toContain('/account');
    expect(mailCountTo(demoAccounts.advisor)).toBe(0);
    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'digest.' } });
    expect(log.body.entries[0]).toMatchObject({ action: 'digest.send', actor: demoAccounts.lead });
  });

  it('sends no empty digest', async () => {
    expect((await call(me, 'PATCH', { session: s.advisor, body: { digestOptIn: true } })).status).toBe(200);
    // Seen from a week in 2100 nothing is new; only the member still has unfinished onboarding steps.
    const run = await sendDigests({
      base: 'http://localhost:4321',
      actor: null,
      now: new Date('2100-01-08T00:00:00Z'),
    });
    expect(run).toMatchObject({ recipients: 2, sent: 1, skipped: 1, failed: 0 });
    expect(mailCountTo(demoAccounts.advisor)).toBe(0);
  });

  it('accepts the scheduler with the cron token, and refuses a wrong token', async () => {
    const ok = await call(digest, 'POST', { headers: { authorization: `Bearer ${CRON}` }, body: { days: 7 } });
    expect(ok.status).toBe(200);
    expect(ok.body.recipients).toBeGreaterThan(0);
    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'digest.' } });
    expect(log.body.entries[0]).toMatchObject({ actor: 'system' });
    expect(
      (await call(digest, 'POST', { headers: { authorization: `Bearer ${'x'.repeat(40)}` }, body: {} })).status,
    ).toBe(401);
    expect((await call(digest, 'POST', { headers: { authorization: CRON }, body: {} })).status).toBe(401);
  });

  it('refuses non-leads (403), the signed-out (401) and a bad body (400)', async () => {
    for (const role of ['advisor', 'member', 'alumni'] as const)
      expect((await call(digest, 'POST', { session: s[role], body: {} })).status).toBe(403);
    expect((await call(digest, 'POST', { body: {} })).status).toBe(401);
    expect((await call(digest, 'POST', { session: s.lead, body: { days: 90 } })).status).toBe(400);
  });
});
