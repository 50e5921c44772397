import { describe, expect, it } from 'vitest';
import { formatInputValue, formatNumber, plainText } from '~/lib/format';

describe('plainText', () => {
  it('keeps strings and writes other primitives as String() does', () => {
    expect(plainText('B-series')).toBe('B-series');
    expect(plainText(3)).toBe('3');
    expect(plainText(true)).toBe('true');
    expect(plainText(null)).toBe('');
    expect(plainText(undefined)).toBe('');
  });

  it('writes objects and arrays as JSON, not "[object Object]"', () => {
    expect(plainText({ a: 1 })).toBe('{"a":1}');
    expect(plainText([1, 2])).toBe('[1,2]');
    const cycle: Record<string, unknown> = {};
    cycle.self = cycle;
    expect(plainText(cycle)).toBe('');
  });
});

describe('formatNumber and formatInputValue with values that are not numbers', () => {
  it('shows a dash for nothing, text as it is and objects as JSON', () => {
    expect(formatNumber(null)).toBe('–');
    expect(formatNumber('')).toBe('–');
    expect(formatNumber('n/a')).toBe('n/a');
    expect(formatNumber({ rpm: 1200 })).toBe('{"rpm":1200}');
    expect(formatInputValue(undefined)).toBe('–');
    expect(formatInputValue('wood')).toBe('wood');
    expect(formatInputValue({ k: 'v' })).toBe('{"k":"v"}');
  });

  it('still formats numbers with fixed decimals', () => {
    expect(formatNumber(1234.5, 1)).toBe('1,234.5');
    expect(formatInputValue(3, 'integer')).toBe('3');
  });
});
