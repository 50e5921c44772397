import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { heatCapacities, pressure } from '../../src/lib/calc/properties/iapws95';
import { waterProperties } from '../../src/lib/calc/properties/water';

// ITTC Recommended Procedures 7.5-02-01-03 (2011), "Fresh Water and Seawater Properties", tables of density and
// kinematic viscosity (values as listed in REFERENCES.md §3). Tag: published. Tolerances ρ ±0.001 kg/m³, ν 1e-4 relative.
const ITTC_2011 = [
  { water: 'fresh', t: 15, rho: 999.1026, nu: 1.1386e-6 },
  { water: 'fresh', t: 20, rho: 998.2071, nu: 1.0034e-6 },
  { water: 'sea', t: 15, rho: 1026.021, nu: 1.1892e-6 },
  { water: 'sea', t: 20, rho: 1024.8103, nu: 1.0508e-6 },
] as const;

describe('water properties — ITTC 7.5-02-01-03 (2011), Fresh Water and Seawater Properties, tables (published)', () => {
  for (const c of ITTC_2011) {
    it(`${c.water} water at ${c.t} °C: ρ ${c.rho} kg/m³, ν ${c.nu} m²/s (ITTC 2011 table, published)`, () => {
      const r = runCalculator('water', { temperature_C: c.t, water: c.water });
      if (!r.ok) throw new Error(JSON.stringify(r));
      const o = r.result.outputs as { density_kgm3: number; kinematicViscosity_m2s: number };
      expect(Math.abs(o.density_kgm3 - c.rho)).toBeLessThanOrEqual(0.001);
      expect(Math.abs(o.kinematicViscosity_m2s - c.nu) / c.nu).toBeLessThanOrEqual(1e-4);
    });
  }
});

describe('IAPWS-95 implementation — IAPWS R6-95(2018), Table 7 verification values at T = 300 K (published)', () => {
  it('ρ 996.556 kg/m³ → p 0.0992418352 MPa, c_v 4.13018112 kJ/(kg·K) (IAPWS R6-95(2018) Table 7, row 1)', () => {
    expect(pressure(300, 996.556) / 1e6).toBeCloseTo(0.0992418352, 9);
    expect(heatCapacities(300, 996.556).cv / 1e3).toBeCloseTo(4.13018112, 7);
  });
  it('ρ 1005.308 kg/m³ → p 20.0022515 MPa, c_v 4.06798347 kJ/(kg·K) (IAPWS R6-95(2018) Table 7, row 2)', () => {
    expect(pressure(300, 1005.308) / 1e6).toBeCloseTo(20.0022515, 6);
    expect(heatCapacities(300, 1005.308).cv / 1e3).toBeCloseTo(4.06798347, 7);
  });
});

describe('off the check points the formulation is evaluated, not interpolated', () => {
  it('density falls monotonically from 4 °C to 40 °C and has its maximum near 4 °C (fresh water)', () => {
    const rho = (t: number) => waterProperties(t, 'fresh').density_kgm3;
    expect(rho(3.98)).toBeGreaterThan(rho(2));
    expect(rho(3.98)).toBeGreaterThan(rho(6));
    for (let t = 5; t <= 40; t++) expect(rho(t)).toBeLessThan(rho(t - 1));
  });
  it('seawater is denser and more viscous than fresh water at every whole degree 0–40 °C', () => {
    for (let t = 0; t <= 40; t++) {
      const f = waterProperties(t, 'fresh');
      const s = waterProperties(t, 'sea');
      expect(s.density_kgm3 - f.density_kgm3).toBeGreaterThan(24);
      expect(s.dynamicViscosity_Pas).toBeGreaterThan(f.dynamicViscosity_Pas);
    }
  });
});
