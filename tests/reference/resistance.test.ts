import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { ittc57 } from '../../src/lib/calc/resistance';

// 8th ITTC (1957) model-ship correlation line, C_F = 0.075/(log₁₀Re − 2)²; J.B. Hadler (1958), DTMB Report 1185.
describe('ITTC-1957 friction line — exact values (REFERENCES.md §2, derived)', () => {
  it('C_F(1e6) = 0.0046875', () => expect(ittc57(1e6)).toBeCloseTo(0.0046875, 15));
  it('C_F(1e7) = 0.003', () => expect(ittc57(1e7)).toBeCloseTo(0.003, 15));
  it('C_F(1e8) = 0.075/36', () => expect(ittc57(1e8)).toBeCloseTo(0.075 / 36, 15));
});

describe('ITTC-1957 worked value — A. Morrall (1970), NPL Ship Report 142, "1957 ITTC model-ship correlation line values of frictional resistance coefficient" (published)', () => {
  it('Rn 5.62·10⁶ → C_F 3.325·10⁻³ (4 s.f., relative 5e-4)', () => {
    expect(Math.abs(ittc57(5.62e6) - 3.325e-3) / 3.325e-3).toBeLessThanOrEqual(5e-4);
  });
});

describe('resistance calculator arithmetic on the ITTC-1957 line (REFERENCES.md §2 formulas, derived)', () => {
  it('R_T = (1+k)·½ρV²S·C_F + ½ρV²·C_D·A with ρ, ν from ITTC 7.5-02-01-03 (2011) at 20 °C fresh', () => {
    const r = runCalculator('resistance', {
      length_m: 5,
      wettedArea_m2: 3,
      speed_mps: 2.0068,
      formFactor: 1.1,
      appendageDragArea_m2: 0.004,
      temperature_C: 20,
      water: 'fresh',
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    const rho = 998.2071; // ITTC 2011 table, 20 °C fresh
    const nu = 1.0034e-6;
    const re = (2.0068 * 5) / nu; // ≈ 1.0e7
    expect(Math.abs(o.reynolds - re) / re).toBeLessThan(1e-4);
    const q = 0.5 * rho * 2.0068 ** 2;
    const cf = 0.075 / (Math.log10(re) - 2) ** 2;
    expect(Math.abs(o.cf - cf)).toBeLessThan(1e-7);
    expect(Math.abs(o.totalResistance_N - (1.1 * q * 3 * cf + q * 0.004)) / o.totalResistance_N).toBeLessThan(1e-4);
    expect(o.effectivePower_W).toBeCloseTo(o.totalResistance_N * 2.0068, 9);
  });
});

// Froude number Fn = V/√(gL) (W. Froude; common practice: above Fn ≈ 0.4 wave-making resistance of a displacement hull
// rises steeply, so a friction-only estimate is incomplete). Derived from the definition, g = 9.80665 m/s².
describe('resistance — Froude number and the speed-length warning (common practice)', () => {
  const run = (raw: Record<string, unknown>) => {
    const r = runCalculator('resistance', raw);
    if (!r.ok) throw new Error(JSON.stringify(r));
    return r.result;
  };
  it('Fn = V/√(gL): 5 m/s on 5.5 m → 0.68081', () =>
    expect(run({}).outputs.froude).toBeCloseTo(5 / Math.sqrt(9.80665 * 5.5), 12));
  it('above 0.4 it warns that wave-making resistance is missing and points to the planing calculator', () => {
    expect(run({ speed_mps: 3 }).warnings.join(' ')).toMatch(/wave-making.*planing/s);
  });
  it('at Fn 0.35 it does not', () => {
    const v = 0.35 * Math.sqrt(9.80665 * 5.5);
    expect(run({ speed_mps: v }).warnings.join(' ')).not.toMatch(/wave-making/);
  });
});
