import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../../src/lib/calc';
import { B_COVERAGE, bSeries, cubic, openWaterEfficiency } from '../../../src/lib/calc/bseries';
import { idealEfficiency } from '../../../src/lib/calc/propeller';

// Properties of REFERENCES.md §1 and §7 that hold without any table.
const PITCHES = [0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1, 1.2, 1.3, 1.4];

describe('B-series open-water properties', () => {
  it('η₀(J = 0) = 0 for every blade number, area and pitch', () => {
    for (const Z of [2, 3, 4, 5, 6, 7])
      for (const ae of [0.3, 0.55, 0.8, 1.05])
        for (const pd of PITCHES) expect(openWaterEfficiency(bSeries(Z, ae, pd), 0)).toBe(0);
  });

  it('K_T and K_Q increase with P/D at fixed J (within the tested blade areas)', () => {
    let checked = 0;
    for (const Z of [2, 3, 4, 5, 6, 7]) {
      const [lo, hi] = B_COVERAGE[Z];
      for (const ae of [lo, (lo + hi) / 2, hi])
        for (const J of [0, 0.2, 0.4, 0.6]) {
          for (let i = 1; i < PITCHES.length; i++) {
            const a = bSeries(Z, ae, PITCHES[i - 1]);
            const b = bSeries(Z, ae, PITCHES[i]);
            expect(cubic(b.kt, J)).toBeGreaterThan(cubic(a.kt, J));
            expect(cubic(b.kq, J)).toBeGreaterThan(cubic(a.kq, J));
            checked++;
          }
        }
    }
    expect(checked).toBeGreaterThan(300);
  });

  it('η₀ never exceeds the actuator-disk ideal efficiency at the same C_T = 8·K_T/(π·J²)', () => {
    let checked = 0;
    for (const Z of [2, 3, 4, 5, 6, 7]) {
      const [lo, hi] = B_COVERAGE[Z];
      for (const ae of [lo, hi])
        for (const pd of PITCHES) {
          const p = bSeries(Z, ae, pd);
          for (let k = 1; k < 40; k++) {
            const J = (p.jZeroThrust * k) / 40;
            const kt = cubic(p.kt, J);
            const ct = (8 * kt) / (Math.PI * J * J);
            expect(openWaterEfficiency(p, J)).toBeLessThan(idealEfficiency(ct));
            checked++;
          }
        }
    }
    expect(checked).toBeGreaterThan(900);
  });

  it('P_D = T·V_A/η₀ at calculator operating points', () => {
    for (const [rpm, speed, w] of [
      [1200, 2, 0],
      [1800, 4.5, 0.05],
      [2500, 6, 0.1],
    ]) {
      const r = runCalculator('propeller', {
        blades: 3,
        bladeAreaRatio: 0.5,
        pitchRatio: 1.1,
        diameter_m: 0.22,
        rpm,
        speed_mps: speed,
        wakeFraction: w,
      });
      if (!r.ok) throw new Error(JSON.stringify(r));
      const o = r.result.outputs as Record<string, number>;
      const vA = speed * (1 - w);
      expect(o.shaftPower_W).toBeCloseTo((o.thrust_N * vA) / o.efficiency, 6);
    }
  });

  it('the open-water series runs from J = 0 to K_T = 0 with K_T, 10·K_Q and η₀', () => {
    const r = runCalculator('propeller', {});
    if (!r.ok) throw new Error(JSON.stringify(r));
    const s = r.result.series!.openWater;
    expect(s.x.values[0]).toBe(0);
    expect(s.y.map((a) => a.name)).toEqual(['kt', 'kq10', 'efficiency']);
    const kt = s.y[0].values;
    expect(Math.abs(kt[kt.length - 1])).toBeLessThan(1e-9);
    expect(kt.slice(0, -1).every((v) => v > 0)).toBe(true);
    expect(s.y[2].values[0]).toBe(0);
  });
});
