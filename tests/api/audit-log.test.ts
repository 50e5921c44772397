import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as audit from '../../src/pages/api/audit';
import * as signIn from '../../src/pages/api/auth/sign-in';
import * as status from '../../src/pages/api/records/[id]/status';
import * as review from '../../src/pages/api/guides/[slug]/review';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type Entry = {
  actor: string;
  action: string;
  actionText: string;
  targetTitle: string | null;
  targetUrl: string | null;
};
const entries = async (q: Record<string, string> = {}): Promise<Entry[]> =>
  (await call(audit, 'GET', { session: s.lead, query: q })).body.entries;

describe('the audit log reads in words', () => {
  it('a failed sign-in is listed by the address tried, in words, with no target link', async () => {
    const res = await call(signIn, 'POST', {
      body: { email: 'Not.A.Member@Example.test', password: 'wrong-password-123' },
      ip: '127.3.3.3',
    });
    expect(res.status).toBe(401);
    const [e] = await entries({ action: 'auth.sign-in-failed' });
    expect(e).toMatchObject({ actor: 'not.a.member@example.test', actionText: 'failed to sign in', targetUrl: null });
    const byAddress = await entries({ actor: 'not.a.member@example.test' });
    expect(byAddress.map((x) => x.action)).toContain('auth.sign-in-failed');
  });

  it('record and guide targets are titles with links, actions are words', async () => {
    await call(status, 'POST', {
      session: s.lead,
      params: { id: 'demo-rec-2526-two-propellers' },
      body: { status: 'withdrawn' },
    });
    const [rec] = await entries({ action: 'record.' });
    expect(rec.actionText).toBe('changed the status of');
    expect(rec.targetUrl).toBe('/records/demo-rec-2526-two-propellers');
    expect(rec.targetTitle).not.toMatch(/^record[: ]/);
    expect(rec.targetTitle!.length).toBeGreaterThan(5);

    expect(
      (await call(review, 'POST', { session: s.advisor, params: { slug: 'handover-checklist' }, body: {} })).status,
    ).toBe(201);
    const [g] = await entries({ action: 'guide.' });
    expect(g).toMatchObject({
      actionText: 'reviewed the guide',
      targetTitle: 'Handover checklist for an outgoing cohort',
      targetUrl: '/guides/handover-checklist',
    });
    const all = await entries({ limit: '200' });
    for (const x of all) expect(x.actionText).not.toMatch(/^[a-z]+\.[a-z-]+$/);
  });
});
