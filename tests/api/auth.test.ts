import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionFor, demoAccounts } from '../setup/db';
import * as signIn from '../../src/pages/api/auth/sign-in';
import * as signOut from '../../src/pages/api/auth/sign-out';
import * as me from '../../src/pages/api/me';
import * as health from '../../src/pages/api/health';
import * as audit from '../../src/pages/api/audit';
import { SESSION_COOKIE } from '../../src/lib/server/auth/lucia';

beforeAll(seedDemo);

function expectErrorShape(body: { error: { code: unknown; message: unknown; issues: unknown } }, code: string) {
  expect(body.error.code).toBe(code);
  expect(typeof body.error.message).toBe('string');
  expect(Array.isArray(body.error.issues)).toBe(true);
  expect(JSON.stringify(body)).not.toMatch(/at .*\.(ts|js|mjs):\d+/); // no stack traces
}

describe('GET /api/health', () => {
  it('answers ok when the database answers', async () => {
    const res = await call(health, 'GET');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});

describe('POST /api/auth/sign-in', () => {
  it('signs a demo member in and sets an HttpOnly, SameSite=Lax session cookie', async () => {
    const res = await call(signIn, 'POST', { body: { email: 'Member@Wakebook.test ', password: 'wakebook-demo' } });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: demoAccounts.member, role: 'member', name: 'Jonas Lindqvist' });
    expect(res.body.user.passwordHash).toBeUndefined();
    expect(res.cookies.get(SESSION_COOKIE)).toMatch(/^[a-z0-9]{20,}$/);
    const raw = res.setCookie.find((c) => c.startsWith(`${SESSION_COOKIE}=`)) ?? '';
    expect(raw).toMatch(/HttpOnly/);
    expect(raw).toMatch(/SameSite=Lax/);
    expect(res.text).not.toContain('argon2');
  });

  it('refuses a wrong password with 401 invalid_credentials', async () => {
    const res = await call(signIn, 'POST', {
      body: { email: demoAccounts.lead, password: 'not-the-password' },
      ip: '127.0.2.1',
    });
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'invalid_credentials');
    expect(res.cookies.get(SESSION_COOKIE)).toBeUndefined();
  });

  it('answers an unknown account exactly like a wrong password', async () => {
    const res = await call(signIn, 'POST', {
      body: { email: 'nobody@wakebook.test', password: 'whatever-it-is' },
      ip: '127.0.2.2',
    });
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'invalid_credentials');
  });

  it('names each bad field in a malformed body (400 invalid_input)', async () => {
    const res = await call(signIn, 'POST', { body: { email: 'not-an-email', password: 42 } });
    expect(res.status).toBe(400);
    expectErrorShape(res.body, 'invalid_input');
    const paths = res.body.error.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['email', 'password']);
  });

  it('answers 400 to a body that is not JSON', async () => {
    const res = await call(signIn, 'POST', { rawBody: '{"email": ', headers: { 'content-type': 'application/json' } });
    expect(res.status).toBe(400);
    expectErrorShape(res.body, 'invalid_input');
  });

  it('answers 413 to an oversized body', async () => {
    const res = await call(signIn, 'POST', { body: { email: 'a@b.c', password: 'x'.repeat(40_000) } });
    expect(res.status).toBe(413);
    expectErrorShape(res.body, 'too_large');
  });

  it('throttles repeated failures on one account with 429 and retry-after', async () => {
    const email = demoAccounts.alumni;
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await call(signIn, 'POST', { body: { email, password: `wrong-${i}` }, ip: `127.0.3.${i}` });
      statuses.push(res.status);
      if (res.status === 429) {
        expectErrorShape(res.body, 'rate_limited');
        expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
      }
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    // Even the right password waits until the window passes.
    const right = await call(signIn, 'POST', { body: { email, password: 'wakebook-demo' }, ip: '127.0.3.9' });
    expect(right.status).toBe(429);
  });
});

describe('GET /api/me and sign-out', () => {
  it('401 when signed out', async () => {
    const res = await call(me, 'GET');
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'unauthenticated');
  });

  it('401 with a made-up session cookie', async () => {
    const res = await call(me, 'GET', { session: 'abcdefghijklmnopqrstuvwxyz234567' });
    expect(res.status).toBe(401);
  });

  it('returns the signed-in user with their role', async () => {
    const session = await sessionFor('advisor');
    const res = await call(me, 'GET', { session });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      user: { id: expect.any(String), email: demoAccounts.advisor, name: 'Dr. Felix Arnaud', role: 'advisor' },
    });
  });

  it('sign-out answers 204, clears the cookie and deletes the session on the server', async () => {
    const session = await sessionFor('member');
    const out = await call(signOut, 'POST', { session });
    expect(out.status).toBe(204);
    expect(out.cookies.get(SESSION_COOKIE)).toBe('');
    const after = await call(me, 'GET', { session });
    expect(after.status).toBe(401);
  });
});

describe('role checks', () => {
  it('a member may not read the audit log (403), a lead may', async () => {
    const member = await call(audit, 'GET', { session: await sessionFor('member') });
    expect(member.status).toBe(403);
    expectErrorShape(member.body, 'forbidden');
    const lead = await call(audit, 'GET', { session: await sessionFor('lead') });
    expect(lead.status).toBe(200);
    const actions = lead.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toContain('auth.sign-in');
    expect(actions).toContain('auth.sign-in-failed');
  });

  it('the audit log refuses a bad limit with 400', async () => {
    const res = await call(audit, 'GET', { session: await sessionFor('lead'), query: { limit: 'lots' } });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('limit');
  });
});
