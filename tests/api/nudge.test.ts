import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as nudge from '../../src/pages/api/people/[id]/nudge';
import * as audit from '../../src/pages/api/audit';
import { listPeople } from '../../src/lib/server/people';
import { latestMailTo, linkIn, mailCountTo } from '../setup/mail';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('POST /api/people/{id}/nudge — a real reminder e-mail, audited', () => {
  it('a lead nudges a member: one e-mail naming their routes and progress, linking the route, and an audit entry', async () => {
    const jonas = listPeople().find((p) => p.name === 'Jonas Lindqvist')!;
    const before = mailCountTo(jonas.email);
    const res = await call(nudge, 'POST', {
      session: s.lead,
      params: { id: jonas.id },
      body: { note: 'The pod trials are on Saturday.' },
    });
    expect(res.status).toBe(201);
    expect(res.body.mail.status).toBe('captured');
    expect(mailCountTo(jonas.email)).toBe(before + 1);
    const mail = latestMailTo(jonas.email);
    expect(mail.subject).toMatch(/carry on with your onboarding/);
    expect(mail.text).toMatch(/Propulsion and motor drive \d+ of \d+/);
    expect(mail.text).toContain('The pod trials are on Saturday.');
    expect(new URL(linkIn(mail.text)).pathname).toMatch(/^\/subsystems\/(propulsion|cooling)$/);
    const entries = (await call(audit, 'GET', { session: s.lead, query: { action: 'onboarding.' } })).body.entries;
    expect(entries[0]).toMatchObject({
      action: 'onboarding.nudge',
      actionText: 'nudged',
      targetTitle: expect.stringContaining('Jonas Lindqvist'),
    });
  });

  it('only leads nudge (403); an unknown person is 404 and sends nothing', async () => {
    const jonas = listPeople().find((p) => p.name === 'Jonas Lindqvist')!;
    const before = mailCountTo(jonas.email);
    for (const role of ['advisor', 'member', 'alumni'] as const)
      expect((await call(nudge, 'POST', { session: s[role], params: { id: jonas.id }, body: {} })).status).toBe(403);
    expect((await call(nudge, 'POST', { session: s.lead, params: { id: 'nobody' }, body: {} })).status).toBe(404);
    expect(mailCountTo(jonas.email)).toBe(before);
  });
});
