import { describe, it, expect } from 'vitest';
import { newId, newToken, hashToken } from '../../src/lib/server/ids';

describe('ids and tokens', () => {
  it('ids are 16 lower-case base32 characters and do not repeat', () => {
    const ids = new Set(Array.from({ length: 1000 }, newId));
    expect(ids.size).toBe(1000);
    for (const id of ids) expect(id).toMatch(/^[a-z2-7]{16}$/);
  });

  it('tokens are at least 20 URL-safe characters', () => {
    const t = newToken();
    expect(t.length).toBeGreaterThanOrEqual(20);
    expect(t).toMatch(/^[A-Za-z0-9_-]+$/);
  });

  it('hashToken is SHA-256 hex (FIPS 180-4 test vector "abc")', () => {
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(hashToken(newToken())).toMatch(/^[0-9a-f]{64}$/);
  });
});
