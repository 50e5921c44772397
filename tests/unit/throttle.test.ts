import { describe, it, expect } from 'vitest';
import { Throttle } from '../../src/lib/server/auth/throttle';

describe('Throttle', () => {
  it('allows up to the limit of failures in the window, then asks to wait', () => {
    let now = 1_000_000;
    const t = new Throttle(3, 60_000, () => now);
    for (let i = 0; i < 3; i++) {
      expect(t.retryAfter('a')).toBe(0);
      t.fail('a');
    }
    expect(t.retryAfter('a')).toBe(60);
    now += 30_000;
    expect(t.retryAfter('a')).toBe(30);
    now += 30_001;
    expect(t.retryAfter('a')).toBe(0);
  });

  it('keeps keys apart and forgets a key on clear', () => {
    const t = new Throttle(1, 60_000, () => 5);
    t.fail('a');
    expect(t.retryAfter('a')).toBeGreaterThan(0);
    expect(t.retryAfter('b')).toBe(0);
    t.clear('a');
    expect(t.retryAfter('a')).toBe(0);
  });
});
