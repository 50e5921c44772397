import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionFor, demoAccounts } from '../setup/db';
import { latestMailTo, linkIn, mailCountTo, tokenIn } from '../setup/mail';
import * as requestReset from '../../src/pages/api/auth/request-reset';
import * as reset from '../../src/pages/api/auth/reset';
import * as signIn from '../../src/pages/api/auth/sign-in';
import * as me from '../../src/pages/api/me';
import { countSessions } from '../../src/lib/server/auth/lucia';
import { db } from '../../src/lib/server/db/client';
import { passwordResets, users } from '../../src/lib/server/db/schema';
import { hashToken } from '../../src/lib/server/ids';
import { resetByAccount, resetByAddress } from '../../src/lib/server/auth/throttle';

beforeAll(seedDemo);

const NEW_PASSWORD = 'bright-hull-keel-2026';

describe('POST /api/auth/request-reset', () => {
  it('answers 202 for an account and mails a one-hour link whose last segment is the token', async () => {
    const res = await call(requestReset, 'POST', { body: { email: 'Advisor@Wakebook.test' }, ip: '127.0.5.1' });
    expect(res.status).toBe(202);
    const mail = latestMailTo(demoAccounts.advisor);
    expect(mail.subject).toBe('Reset your Wakebook password');
    expect(new URL(linkIn(mail.text)).pathname).toMatch(/^\/reset\/[A-Za-z0-9_-]{20,}$/);
    const row = db()
      .select()
      .from(passwordResets)
      .where(eq(passwordResets.tokenHash, hashToken(tokenIn(mail.text))))
      .get()!;
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBe(3600 * 1000);
  });

  it('answers an unknown address with the same 202 and body, and sends nothing', async () => {
    const known = await call(requestReset, 'POST', { body: { email: demoAccounts.alumni }, ip: '127.0.5.2' });
    const unknown = await call(requestReset, 'POST', { body: { email: 'nobody@northmere.example' }, ip: '127.0.5.2' });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(mailCountTo('nobody@northmere.example')).toBe(0);
  });

  it('refuses a malformed address with 400', async () => {
    const res = await call(requestReset, 'POST', { body: { email: 'not-an-address' } });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('email');
  });

  it('throttles repeated requests for one address with 429 and retry-after', async () => {
    resetByAccount.clear('member@wakebook.test');
    const statuses: number[] = [];
    let retryAfter = '';
    for (let i = 0; i < 4; i++) {
      const res = await call(requestReset, 'POST', { body: { email: demoAccounts.member }, ip: `127.0.6.${i}` });
      statuses.push(res.status);
      if (res.status === 429) retryAfter = res.headers.get('retry-after') ?? '';
    }
    expect(statuses).toEqual([202, 202, 202, 429]);
    expect(Number(retryAfter)).toBeGreaterThan(0);
  });

  it('throttles many requests from one address across accounts', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++)
      statuses.push(
        (await call(requestReset, 'POST', { body: { email: `x${i}@northmere.example` }, ip: '127.0.7.7' })).status,
      );
    expect(statuses.filter((x) => x === 202)).toHaveLength(10);
    expect(statuses[10]).toBe(429);
    resetByAddress.clear('127.0.7.7');
  });
});

describe('POST /api/auth/reset', () => {
  it('sets the new password, ends every session of the account, and the link works once', async () => {
    const a = await sessionFor('lead');
    const b = await sessionFor('lead');
    const lead = db().select().from(users).where(eq(users.email, demoAccounts.lead)).get()!;
    expect(countSessions(lead.id)).toBeGreaterThanOrEqual(2);
    await call(requestReset, 'POST', { body: { email: demoAccounts.lead }, ip: '127.0.8.1' });
    const token = tokenIn(latestMailTo(demoAccounts.lead).text);

    const weak = await call(reset, 'POST', { body: { token, password: 'password1234' } });
    expect(weak.status).toBe(400);
    expect(weak.body.error.issues[0].path).toBe('password');

    const res = await call(reset, 'POST', { body: { token, password: NEW_PASSWORD } });
    expect(res.status).toBe(204);
    expect(res.text).toBe('');
    expect(countSessions(lead.id)).toBe(0);
    expect((await call(me, 'GET', { session: a })).status).toBe(401);
    expect((await call(me, 'GET', { session: b })).status).toBe(401);

    const old = await call(signIn, 'POST', {
      body: { email: demoAccounts.lead, password: 'wakebook-demo' },
      ip: '127.0.8.2',
    });
    expect(old.status).toBe(401);
    const fresh = await call(signIn, 'POST', {
      body: { email: demoAccounts.lead, password: NEW_PASSWORD },
      ip: '127.0.8.3',
    });
    expect(fresh.status).toBe(200);

    const again = await call(reset, 'POST', { body: { token, password: 'another-long-pass-99' } });
    expect(again.status).toBe(400);
    expect(again.body.error.reason).toBe('used');
  });

  it('spends every other open link of the account when one is used', async () => {
    await call(requestReset, 'POST', { body: { email: demoAccounts.alumni }, ip: '127.0.8.4' });
    const first = tokenIn(latestMailTo(demoAccounts.alumni).text);
    await call(requestReset, 'POST', { body: { email: demoAccounts.alumni }, ip: '127.0.8.5' });
    const second = tokenIn(latestMailTo(demoAccounts.alumni).text);
    expect(second).not.toBe(first);
    expect((await call(reset, 'POST', { body: { token: second, password: NEW_PASSWORD } })).status).toBe(204);
    expect((await call(reset, 'POST', { body: { token: first, password: NEW_PASSWORD } })).body.error.reason).toBe(
      'used',
    );
  });

  it('refuses an expired link (400 expired) and one never issued (404)', async () => {
    resetByAccount.clear(demoAccounts.advisor);
    await call(requestReset, 'POST', { body: { email: demoAccounts.advisor }, ip: '127.0.8.6' });
    const token = tokenIn(latestMailTo(demoAccounts.advisor).text);
    db()
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1) })
      .where(eq(passwordResets.tokenHash, hashToken(token)))
      .run();
    const expired = await call(reset, 'POST', { body: { token, password: NEW_PASSWORD } });
    expect(expired.status).toBe(400);
    expect(expired.body.error.reason).toBe('expired');
    const unknown = await call(reset, 'POST', { body: { token: 'Z'.repeat(27), password: NEW_PASSWORD } });
    expect(unknown.status).toBe(404);
    const missing = await call(reset, 'POST', { body: { password: NEW_PASSWORD } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0].path).toBe('token');
  });
});
