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

describe('Throttle.reserve', () => {
  it('counts the attempt at once, and the returned function takes only that one back', () => {
    const t = new Throttle(2, 60_000, () => 7);
    const release = t.reserve('a');
    t.reserve('a');
    expect(t.retryAfter('a')).toBeGreaterThan(0);
    release();
    expect(t.retryAfter('a')).toBe(0);
    release(); // a second call has nothing left to take back
    t.reserve('a');
    expect(t.retryAfter('a')).toBeGreaterThan(0);
  });
});
