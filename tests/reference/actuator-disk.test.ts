import { describe, expect, it } from 'vitest';
import { idealEfficiency } from '../../src/lib/calc/propeller';

// Actuator-disk momentum theory: W.J.M. Rankine (1865), Trans. INA 6; R.E. Froude (1889), Trans. INA 30.
// η_ideal = 2/(1 + √(1 + C_T)); exact values from REFERENCES.md §7 (derived).
describe('ideal propulsive efficiency — Rankine (1865) / Froude (1889) actuator disk, REFERENCES.md §7 (derived)', () => {
  it('C_T 1 → 0.8284271247', () => expect(idealEfficiency(1)).toBeCloseTo(0.8284271247, 10));
  it('C_T 3 → 2/3', () => expect(idealEfficiency(3)).toBeCloseTo(2 / 3, 12));
  it('C_T 8 → 0.5', () => expect(idealEfficiency(8)).toBeCloseTo(0.5, 12));
});
