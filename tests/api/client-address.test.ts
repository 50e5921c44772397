// Throttling keys on the socket's address unless a trusted proxy sets X-Forwarded-For, and counts each attempt
// before its password check is awaited, so neither a rotating header nor parallel requests get past the limits.
import { describe, it, expect, beforeAll, afterEach } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, demoAccounts } from '../setup/db';
import * as signIn from '../../src/pages/api/auth/sign-in';
import * as requestReset from '../../src/pages/api/auth/request-reset';
import { resetSettingsForTests } from '../../src/lib/server/config';

beforeAll(seedDemo);
afterEach(() => {
  delete process.env.WAKEBOOK_TRUST_PROXY;
  resetSettingsForTests();
});

/** One request from a fixed socket whose X-Forwarded-For (and so Astro's clientAddress) changes each time. */
function fromRotatingHeader(i: number, socket: string) {
  const forwarded = `198.51.100.${i}`;
  return { socketAddress: socket, ip: forwarded, headers: { 'x-forwarded-for': forwarded } };
}

async function signInStatuses(count: number, socket: string, tag: string): Promise<number[]> {
  const statuses: number[] = [];
  for (let i = 0; i < count; i++) {
    const body = { email: `nobody-${tag}-${i}@wakebook.test`, password: 'wrong-password' };
    statuses.push((await call(signIn, 'POST', { body, ...fromRotatingHeader(i, socket) })).status);
  }
  return statuses;
}

describe('sign-in throttling by address', () => {
  it('keys on the socket address: rotating X-Forwarded-For does not reset the per-address limit', async () => {
    const statuses = await signInStatuses(32, '10.20.0.1', 'socket');
    expect(statuses.slice(0, 30).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(30)).toEqual([429, 429]);
  });

  it('honours X-Forwarded-For when WAKEBOOK_TRUST_PROXY=1', async () => {
    process.env.WAKEBOOK_TRUST_PROXY = '1';
    resetSettingsForTests();
    const statuses = await signInStatuses(32, '10.20.0.2', 'proxy');
    expect(statuses.every((s) => s === 401)).toBe(true);
  });
});

describe('sign-in throttling by account', () => {
  it('40 parallel wrong passwords for one account: at most 5 reach the password check', async () => {
    const attempts = Array.from({ length: 40 }, (_, i) =>
      call(signIn, 'POST', {
        body: { email: demoAccounts.advisor, password: `wrong-${i}` },
        socketAddress: `10.30.0.${i}`,
      }),
    );
    const statuses = (await Promise.all(attempts)).map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(5);
    expect(statuses.filter((s) => s === 429)).toHaveLength(35);
  });

  it('a right password after failures still signs in and clears the account', async () => {
    for (let i = 0; i < 4; i++) {
      const res = await call(signIn, 'POST', {
        body: { email: demoAccounts.member, password: `wrong-${i}` },
        socketAddress: '10.40.0.1',
      });
      expect(res.status).toBe(401);
    }
    const right = { email: demoAccounts.member, password: 'wakebook-demo' };
    expect((await call(signIn, 'POST', { body: right, socketAddress: '10.40.0.1' })).status).toBe(200);
  });
});

describe('reset-request throttling by address', () => {
  async function resetStatuses(count: number, socket: string, tag: string): Promise<number[]> {
    const statuses: number[] = [];
    for (let i = 0; i < count; i++) {
      const body = { email: `nobody-${tag}-${i}@wakebook.test` };
      statuses.push((await call(requestReset, 'POST', { body, ...fromRotatingHeader(i, socket) })).status);
    }
    return statuses;
  }

  it('keys on the socket address: rotating X-Forwarded-For does not reset the limit', async () => {
    const statuses = await resetStatuses(11, '10.50.0.1', 'socket');
    expect(statuses.slice(0, 10).every((s) => s === 202)).toBe(true);
    expect(statuses[10]).toBe(429);
  });

  it('honours X-Forwarded-For when WAKEBOOK_TRUST_PROXY=1', async () => {
    process.env.WAKEBOOK_TRUST_PROXY = '1';
    resetSettingsForTests();
    expect((await resetStatuses(11, '10.50.0.2', 'proxy')).every((s) => s === 202)).toBe(true);
  });

  it('40 parallel requests for one account: at most 3 are let through', async () => {
    const attempts = Array.from({ length: 40 }, (_, i) =>
      call(requestReset, 'POST', { body: { email: demoAccounts.lead }, socketAddress: `10.60.0.${i}` }),
    );
    const statuses = (await Promise.all(attempts)).map((r) => r.status);
    expect(statuses.filter((s) => s === 202)).toHaveLength(3);
  });
});
