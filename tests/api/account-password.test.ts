// Changing one's own password while signed in (issue 13, section 5).
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionFor, demoAccounts } from '../setup/db';
import { latestMailTo, mailCountTo } from '../setup/mail';
import * as password from '../../src/pages/api/account/password';
import * as signIn from '../../src/pages/api/auth/sign-in';
import * as requestReset from '../../src/pages/api/auth/request-reset';
import * as me from '../../src/pages/api/me';
import * as audit from '../../src/pages/api/audit';
import { DEMO_PASSWORD } from '../../src/lib/server/demo/team';
import { db } from '../../src/lib/server/db/client';
import { passwordResets, users } from '../../src/lib/server/db/schema';
import { signInByAccount } from '../../src/lib/server/auth/throttle';

beforeAll(seedDemo);

const NEW = 'heron lantern copper tide';
const change = (session: string | undefined, body: object) => call(password, 'POST', { session, body });
const signInWith = (email: string, pw: string) =>
  call(signIn, 'POST', { body: { email, password: pw }, ip: '127.0.9.9' });

describe('POST /api/account/password', () => {
  it('401 signed out; 400 on currentPassword when it is wrong, and nothing changes', async () => {
    expect((await change(undefined, { currentPassword: DEMO_PASSWORD, newPassword: NEW })).status).toBe(401);
    const s = await sessionFor('alumni');
    const wrong = await change(s, { currentPassword: 'not-the-password', newPassword: NEW });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('invalid_input');
    expect(wrong.body.error.issues).toEqual([
      { path: 'currentPassword', message: 'That is not your current password.' },
    ]);
    expect((await signInWith(demoAccounts.alumni, DEMO_PASSWORD)).status).toBe(200);
    signInByAccount.clear(demoAccounts.alumni);
  });

  it('applies the usual strength rules to the new password (400 on newPassword)', async () => {
    const s = await sessionFor('alumni');
    for (const newPassword of ['short', 'password1234', DEMO_PASSWORD]) {
      const res = await change(s, { currentPassword: DEMO_PASSWORD, newPassword });
      expect(res.status, newPassword).toBe(400);
      expect(new Set(res.body.error.issues.map((i: { path: string }) => i.path))).toEqual(new Set(['newPassword']));
    }
    const missing = await change(s, {});
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual([
      'currentPassword',
      'newPassword',
    ]);
  });

  it('204: the new password works, the old does not; other sessions end, this one stays; audited and mailed', async () => {
    const other1 = await sessionFor('advisor');
    const other2 = await sessionFor('advisor');
    const here = await sessionFor('advisor');
    // A reset link asked for earlier must not be able to undo the change.
    await call(requestReset, 'POST', { body: { email: demoAccounts.advisor }, ip: '127.0.8.8' });
    const mailsBefore = mailCountTo(demoAccounts.advisor);

    const res = await change(here, { currentPassword: DEMO_PASSWORD, newPassword: NEW });
    expect(res.status, res.text).toBe(204);
    expect(res.text).toBe('');

    expect((await call(me, 'GET', { session: here })).status).toBe(200);
    for (const gone of [other1, other2]) expect((await call(me, 'GET', { session: gone })).status).toBe(401);
    expect((await signInWith(demoAccounts.advisor, DEMO_PASSWORD)).status).toBe(401);
    signInByAccount.clear(demoAccounts.advisor);
    expect((await signInWith(demoAccounts.advisor, NEW)).status).toBe(200);

    const advisorId = db().select().from(users).where(eq(users.email, demoAccounts.advisor)).get()!.id;
    const open = db()
      .select()
      .from(passwordResets)
      .where(eq(passwordResets.userId, advisorId))
      .all()
      .filter((r) => !r.usedAt);
    expect(open).toEqual([]);

    expect(mailCountTo(demoAccounts.advisor)).toBe(mailsBefore + 1);
    const mail = latestMailTo(demoAccounts.advisor);
    expect(mail.subject).toBe('Your Wakebook password was changed');
    expect(mail.text).toContain('2 other devices or browsers were signed out');
    expect(mail.text).not.toContain(NEW);

    const lead = await sessionFor('lead');
    const entries = (await call(audit, 'GET', { session: lead, query: { limit: '50', action: 'account.password' } }))
      .body.entries;
    expect(entries[0]).toMatchObject({ action: 'account.password-change' });
  });

  it('wrong current passwords count towards the sign-in limit: 429 once it is reached', async () => {
    const s = await sessionFor('member');
    let last = 0;
    for (let i = 0; i < 6; i++)
      last = (await change(s, { currentPassword: `guess-${i}-wrong`, newPassword: NEW })).status;
    expect(last).toBe(429);
    const right = await change(s, { currentPassword: DEMO_PASSWORD, newPassword: NEW });
    expect(right.status).toBe(429);
    signInByAccount.clear(demoAccounts.member);
    expect((await change(s, { currentPassword: DEMO_PASSWORD, newPassword: NEW })).status).toBe(204);
  });
});
