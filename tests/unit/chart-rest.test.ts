import { describe, expect, it } from 'vitest';
import { restingIndex, valueAt } from '../../src/lib/chart-marks';

describe('the point a chart legend reads without hover', () => {
  const xs = [0.2, 0.4, 0.6, 0.8];
  it('is the entry nearest the marked x', () => {
    expect(restingIndex(xs, [1, 2, 3, 4], 0.55)).toBe(2);
    expect(restingIndex(xs, [1, 2, 3, 4], 0.2)).toBe(0);
  });
  it('is the last entry with a value when nothing is marked', () => {
    expect(restingIndex(xs, [1, 2, 3, 4])).toBe(3);
    expect(restingIndex(xs, [1, 2, null, undefined])).toBe(1);
  });
  it('skips gaps (an overlaid dataset is null where the other has points) and has none for an empty line', () => {
    expect(restingIndex(xs, [null, 2, null, 4], 0.6)).toBe(1);
    expect(restingIndex(xs, [null, null, null, null], 0.6)).toBeNull();
    expect(restingIndex([], [])).toBeNull();
  });
});

describe('a line’s value at the marked x', () => {
  it('is read straight between the neighbouring points, exactly at a point, and null outside', () => {
    expect(valueAt([0, 1, 2], [0, 10, 30], 1.5)).toBe(20);
    expect(valueAt([0, 1, 2], [0, 10, 30], 1)).toBe(10);
    expect(valueAt([0, 1, 2], [0, null, 30], 1.5)).toBe(22.5);
    expect(valueAt([0, 1, 2], [0, 10, 30], 3)).toBeNull();
  });
});
