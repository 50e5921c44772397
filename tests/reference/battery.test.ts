import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { currentForPower } from '../../src/lib/calc/battery';

// Battery pack as S×P cells, each an open-circuit voltage behind its internal resistance: G.L. Plett (2015),
// "Battery Management Systems, Volume I: Battery Modeling", Artech House, ch. 2 (v = OCV − i·R₀). A power load draws
// I from P = I·(V − I·R); the most power a source V behind R can deliver is V²/(4R), at I = V/(2R) (maximum power
// transfer, e.g. A.R. Hambley, "Electrical Engineering: Principles and Applications", Pearson, ch. 2 — memory of the
// textbook's statement, the arithmetic is exact). The worked example's numbers were computed independently in
// Python with the quadratic formula (derived).

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function battery(over: object = {}) {
  const r = runCalculator('battery', over);
  if (!r.ok) throw new Error(JSON.stringify(r));
  return { o: r.result.outputs as Record<string, number | null>, warnings: r.result.warnings };
}

describe('worked example: 14S10P of 3.6 V, 3.5 Ah, 30 mΩ cells carrying 1.5 kW (independent Python, derived)', () => {
  const { o, warnings } = battery({
    cellsSeries: 14,
    cellsParallel: 10,
    cellCapacity_Ah: 3.5,
    cellNominal_V: 3.6,
    cellResistance_ohm: 0.03,
    cellMaxContinuous_A: 10,
    power_W: 1500,
  });
  it('pack 50.4 V, 35 Ah, 1764 Wh, R = 0.03·14/10 = 0.042 Ω', () => {
    expect(o.packNominal_V).toBeCloseTo(50.4, 12);
    expect(o.packCapacity_Ah).toBeCloseTo(35, 12);
    expect(o.packEnergy_Wh).toBeCloseTo(1764, 9);
    expect(o.packResistance_ohm).toBeCloseTo(0.042, 14);
  });
  it('I = 30.539102 A, 49.117358 V under load, 39.170744 W of heat, 0.872546 C, 1.146072 h (relative 1e-12)', () => {
    expect(rel(o.current_A!, 30.539102057292872)).toBeLessThan(1e-12);
    expect(rel(o.loadVoltage_V!, 49.1173577135937)).toBeLessThan(1e-12);
    expect(rel(o.heat_W!, 39.17074368756148)).toBeLessThan(1e-12);
    expect(rel(o.cRate!, 0.8725457730655106)).toBeLessThan(1e-12);
    expect(rel(o.runtime_h!, 1.1460716799838535)).toBeLessThan(1e-12);
    expect(o.loadPower_W).toBeCloseTo(1500, 9);
    expect(o.maxPower_W).toBeCloseTo(15120, 9);
    expect(warnings).toEqual([]);
  });
});

describe('limits and warnings', () => {
  it('exactly V²/(4R) is carried at I = V/(2R); 1 % more cannot be carried (maximum power transfer)', () => {
    const V = 50.4;
    const R = 0.042;
    expect(currentForPower(V, R, (V * V) / (4 * R))).toBeCloseTo(V / (2 * R), 6);
    expect(currentForPower(V, R, (1.01 * V * V) / (4 * R))).toBeNull();
    const { o, warnings } = battery({ power_W: 1.01 * 15120 });
    expect(o.current_A).toBeNull();
    expect(o.heat_W).toBeNull();
    expect(warnings.some((w) => w.startsWith('The pack cannot carry'))).toBe(true);
  });

  it('warns when a cell’s continuous current is exceeded, and not below it', () => {
    // 10P × 10 A = 100 A continuous for the pack
    expect(battery({ current_A: 99 }).warnings.some((w) => w.includes('continuous rating'))).toBe(false);
    const over = battery({ current_A: 101 });
    expect(over.o.cellCurrent_A).toBeCloseTo(10.1, 12);
    expect(over.warnings.some((w) => w.includes('continuous rating'))).toBe(true);
  });

  it('a current load is used as given (it takes precedence over the power); V − I·R and I²·R follow', () => {
    const { o } = battery({ current_A: 40, power_W: 99999 });
    expect(o.current_A).toBe(40);
    expect(o.loadVoltage_V).toBeCloseTo(50.4 - 40 * 0.042, 12);
    expect(o.heat_W).toBeCloseTo(40 * 40 * 0.042, 12);
    expect(o.loadPower_W).toBeCloseTo(40 * (50.4 - 40 * 0.042), 12);
  });

  it('a current that takes the whole voltage cannot be carried', () => {
    const { o, warnings } = battery({ current_A: 1300 });
    expect(o.current_A).toBeNull();
    expect(warnings.some((w) => w.startsWith('The pack cannot carry'))).toBe(true);
  });

  it('physical sanity: more strings in parallel → less current per cell, less heat, lower C-rate; P = I·(V − I·R) holds', () => {
    let last = battery({ cellsParallel: 4 }).o;
    for (const p of [6, 8, 12, 20]) {
      const o = battery({ cellsParallel: p }).o;
      expect(o.cellCurrent_A!).toBeLessThan(last.cellCurrent_A!);
      expect(o.heat_W!).toBeLessThan(last.heat_W!);
      expect(o.cRate!).toBeLessThan(last.cRate!);
      expect(o.current_A! * (o.packNominal_V! - o.current_A! * o.packResistance_ohm!)).toBeCloseTo(1500, 8);
      last = o;
    }
  });

  it('zero internal resistance: I = P/V', () => {
    expect(battery({ cellResistance_ohm: 0 }).o.current_A).toBeCloseTo(1500 / 50.4, 12);
  });
});

describe('energy: average C-rate against a stated limit (arithmetic: usable fraction ÷ race hours)', () => {
  it('a 90 C discharge (0.9 of the pack in 0.01 h) is flagged; a 2-hour race at 0.45 C is not', () => {
    const fast = runCalculator('energy', { raceDuration_h: 0.01 });
    if (!fast.ok) throw new Error(JSON.stringify(fast));
    expect(fast.result.outputs.averageCRate).toBeCloseTo(90, 9);
    expect(fast.result.warnings.some((w) => w.includes('90.0 C'))).toBe(true);
    const slow = runCalculator('energy', { raceDuration_h: 2 });
    if (!slow.ok) throw new Error(JSON.stringify(slow));
    expect(slow.result.outputs.averageCRate).toBeCloseTo(0.45, 12);
    expect(slow.result.warnings.some((w) => w.includes(' C limit'))).toBe(false);
  });

  it('the limit is the user’s: 0.4 C flags the 2-hour race', () => {
    const r = runCalculator('energy', { raceDuration_h: 2, maxCRate: 0.4 });
    if (!r.ok) throw new Error(JSON.stringify(r));
    expect(r.result.warnings.some((w) => w.includes('above the 0.4 C limit'))).toBe(true);
  });
});
