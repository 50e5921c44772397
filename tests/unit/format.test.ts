import { describe, expect, it } from 'vitest';
import { formatInputValue, formatNumber, formatQuantity, formatWithUnit, plainText } from '~/lib/format';

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

describe('formatNumber', () => {
  it('shows fixed decimals with grouping and a real minus sign', () => {
    expect(formatNumber(1234.5678, 2)).toBe('1,234.57');
    expect(formatNumber(-0.25, 3)).toBe('−0.250');
    expect(formatNumber(0, 2)).toBe('0.00');
    expect(formatNumber(-0.0001, 2)).not.toContain('−0');
  });

  it('never writes e-notation: millions drop decimals, beyond 10¹² and tiny values use × 10ⁿ', () => {
    expect(formatNumber(2.74e7, 0)).toBe('27,400,000');
    expect(formatNumber(2.74e7, 3)).toBe('27,400,000');
    expect(formatNumber(3.1e13, 0)).toBe('3.10 × 10¹³');
    expect(formatNumber(0.00012, 3)).toBe('1.20 × 10⁻⁴');
    expect(formatNumber(-9.996e-5, 2)).toBe('−1.00 × 10⁻⁴');
    for (const v of [2.74e7, 1e-9, 6.02e23, 1.0034e-6, 123456789.123])
      for (const d of [0, 2, 6, 10]) expect(formatNumber(v, d)).not.toMatch(/e[+-]?\d/);
  });

  it('shows missing and non-finite values plainly', () => {
    expect(formatNumber(null)).toBe('–');
    expect(formatNumber(undefined)).toBe('–');
    expect(formatNumber(Infinity)).toBe('∞');
    expect(formatNumber(-Infinity)).toBe('−∞');
    expect(formatNumber(NaN)).toBe('–');
    expect(formatNumber('fresh')).toBe('fresh');
  });
});

describe('formatQuantity', () => {
  it('moves a tiny kinematic viscosity to mm²/s instead of a row of zeros', () => {
    expect(formatQuantity(1.0034e-6, 'm²/s', 10)).toEqual({ value: '1.003', unit: 'mm²/s' });
    expect(formatWithUnit(1.0034e-6, 'm²/s', 10)).toBe('1.003 mm²/s');
  });

  it('uses SI prefixes for large and small powers, energies, forces, resistances', () => {
    expect(formatWithUnit(2.74e7, 'W', 0)).toBe('27.40 MW');
    expect(formatWithUnit(250000, 'Wh', 0)).toBe('250.0 kWh');
    expect(formatWithUnit(0.00234, 'Ω', 5)).toBe('2.340 mΩ');
    expect(formatWithUnit(0.0011, 'Pa·s', 8)).toBe('1.100 mPa·s');
    expect(formatWithUnit(0.045, 'N·m', 2)).toBe('45.00 mN·m');
  });

  it('keeps the base unit and the calculator’s decimals between 0.1 and 100 000', () => {
    expect(formatQuantity(4523.4, 'W', 0)).toEqual({ value: '4,523', unit: 'W' });
    expect(formatQuantity(0.25, 'V', 3)).toEqual({ value: '0.250', unit: 'V' });
    expect(formatQuantity(99999, 'N', 1)).toEqual({ value: '99,999.0', unit: 'N' });
  });

  it('leaves units without prefixes (°C, m/s, dimensionless) to formatNumber', () => {
    expect(formatQuantity(24.56, '°C', 1)).toEqual({ value: '24.6', unit: '°C' });
    expect(formatQuantity(2.74e7, '', 0)).toEqual({ value: '27,400,000', unit: '' });
    expect(formatWithUnit(0.61234, '', 3)).toBe('0.612');
    expect(formatQuantity(0, 'W', 0)).toEqual({ value: '0', unit: 'W' });
    expect(formatQuantity(null, 'W', 0)).toEqual({ value: '–', unit: 'W' });
  });
});

describe('formatInputValue', () => {
  it('keeps the decimals the person typed', () => {
    expect(formatInputValue(0.0035)).toBe('0.0035');
    expect(formatInputValue(3, 'integer')).toBe('3');
    expect(formatInputValue(1.5)).toBe('1.5');
    expect(formatInputValue('sea')).toBe('sea');
  });
});
