import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';

// Energy budget E = V_nom·C_Ah, usable E·DoD, average power E_usable/t plus solar over the race window
// (REFERENCES.md §6; arithmetic on the definitions, derived). No Peukert correction (left out on purpose).
describe('energy budget — REFERENCES.md §6 definitions (derived)', () => {
  it('48 V × 40 Ah pack, 90 % usable, 2 h race, 250 W solar, 85 % drivetrain', () => {
    const battery = 48 * 40; // E = V_nom·C_Ah = 1920 Wh
    const r = runCalculator('energy', {
      batteryEnergy_Wh: battery,
      usableFraction: 0.9,
      raceDuration_h: 2,
      solarPower_W: 250,
      drivetrainEfficiency: 0.85,
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    expect(o.availableEnergy_Wh).toBeCloseTo(1920 * 0.9 + 250 * 2, 9);
    expect(o.averageElectricalPower_W).toBeCloseTo((1920 * 0.9 + 500) / 2, 9);
    expect(o.averageShaftPower_W).toBeCloseTo(((1920 * 0.9 + 500) / 2) * 0.85, 9);
  });
});
