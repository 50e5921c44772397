import { describe, it, expect } from 'vitest';
import { hashPassword, verifyPassword, verifyDecoy } from '../../src/lib/server/auth/password';

describe('password hashing (argon2id)', () => {
  it('stores an argon2id hash, never the password', async () => {
    const h = await hashPassword('correct horse battery staple');
    expect(h.startsWith('$argon2id$')).toBe(true);
    expect(h).not.toContain('correct horse');
  });

  it('verifies the right password and refuses a wrong one', async () => {
    const h = await hashPassword('tern-five-propeller');
    expect(await verifyPassword(h, 'tern-five-propeller')).toBe(true);
    expect(await verifyPassword(h, 'tern-five-propellor')).toBe(false);
    expect(await verifyPassword(h, '')).toBe(false);
  });

  it('salts: the same password hashes differently each time', async () => {
    const [a, b] = await Promise.all([hashPassword('same-password-twice'), hashPassword('same-password-twice')]);
    expect(a).not.toBe(b);
  });

  it('treats a malformed stored hash as a failed sign-in, not an error', async () => {
    expect(await verifyPassword('not-a-hash', 'anything')).toBe(false);
  });

  it('the decoy check for unknown accounts always fails', async () => {
    expect(await verifyDecoy('wakebook-decoy-password')).toBe(false);
  });
});
