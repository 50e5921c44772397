import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { copperResistance } from '../../src/lib/calc/cable';

// IEC 60028 annealed copper ρ₂₀ = 1.7241·10⁻⁸ Ω·m, α₂₀ = 0.00393 /K (NBS Handbook 100, "Copper wire tables").
// Check: T.L. Floyd, "Electric Circuit Fundamentals", AWG table, Ω per 1000 ft at 20 °C (published), with the AWG
// diameter definition d = 0.127 mm · 92^((36 − n)/39) (memory). Agreement better than 2e-4 (REFERENCES.md §6).
const awgDiameter_mm = (n: number) => 0.127 * 92 ** ((36 - n) / 39);
const FLOYD = [
  { awg: 10, ohmPer1000ft: 0.9989 },
  { awg: 12, ohmPer1000ft: 1.588 },
  { awg: 14, ohmPer1000ft: 2.525 },
];

describe('copper resistance — Floyd, Electric Circuit Fundamentals, AWG table at 20 °C (published) with IEC 60028 copper', () => {
  for (const c of FLOYD) {
    it(`AWG ${c.awg}: ${c.ohmPer1000ft} Ω per 1000 ft`, () => {
      const area = (Math.PI / 4) * awgDiameter_mm(c.awg) ** 2;
      const R = copperResistance(304.8, area, 20);
      expect(Math.abs(R - c.ohmPer1000ft) / c.ohmPer1000ft).toBeLessThan(2e-4);
    });
  }
});

describe('cable calculator — loop length, ΔV = I·R, P = I²R, temperature coefficient (IEC 60028; REFERENCES.md §6, derived)', () => {
  it('100 A, 2 m one way, 16 mm², 60 °C, 48 V', () => {
    const r = runCalculator('cable', {
      current_A: 100,
      length_m: 2,
      crossSection_mm2: 16,
      temperature_C: 60,
      systemVoltage_V: 48,
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    const R = ((1.7241e-8 * 4) / 16e-6) * (1 + 0.00393 * 40);
    expect(o.resistance_ohm).toBeCloseTo(R, 14);
    expect(o.voltageDrop_V).toBeCloseTo(100 * R, 12);
    expect(o.powerLoss_W).toBeCloseTo(100 * 100 * R, 10);
    expect(o.voltageDropPercent).toBeCloseTo((100 * 100 * R) / 48, 10);
  });
});
