import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { coolantProperties } from '../../src/lib/calc/coolant';
import { junctionTemperature } from '../../src/lib/calc/cooling';
import { colebrook, frictionFactor, haaland, swameeJain } from '../../src/lib/calc/pipe';
import { freshWaterCp } from '../../src/lib/calc/properties/water';

// Water c_p from IAPWS-95 at 0.101325 MPa (REFERENCES.md §5, derived from IAPWS R6-95(2018)).
const CP = [
  [10, 4195.16],
  [20, 4184.05],
  [25, 4181.31],
  [30, 4179.82],
  [40, 4179.41],
] as const;

describe('water specific heat — IAPWS R6-95(2018) formulation, values of REFERENCES.md §5 (derived)', () => {
  for (const [t, cp] of CP)
    it(`${t} °C → ${cp} J/(kg·K)`, () => expect(Math.abs(freshWaterCp(t) - cp)).toBeLessThanOrEqual(0.01));
});

describe('junction temperature through series thermal resistances — datasheet practice, REFERENCES.md §5 (published arithmetic example)', () => {
  it('5 W through 3 + 1 + 8 °C/W from 25 °C → 85 °C junction, 70 °C case', () => {
    expect(junctionTemperature(25, 5, [3, 1, 8])).toBeCloseTo(85, 12);
    // case = ambient + P·(case–sink + sink–ambient)
    expect(junctionTemperature(25, 5, [1, 8])).toBeCloseTo(70, 12);
  });
});

// C. Bell, "fluids" library documentation, fluids.friction examples (published values, REFERENCES.md §5).
describe('friction factors — fluids library documentation examples (C. Bell; Colebrook 1939, Haaland 1983, Swamee & Jain 1976) (published)', () => {
  it('laminar f(Re 128) = 0.5', () => expect(frictionFactor(128, 0)).toBeCloseTo(0.5, 15));
  it('Colebrook(Re 1e5, ε/D 1e-4) = 0.018513866077471', () =>
    expect(colebrook(1e5, 1e-4)).toBeCloseTo(0.018513866077471, 13));
  it('Haaland(Re 1e5, ε/D 1e-4) = 0.018265053014793857', () =>
    expect(haaland(1e5, 1e-4)).toBeCloseTo(0.018265053014793857, 14));
  it('Swamee–Jain(Re 1e5, ε/D 1e-4) = 0.018452424431901808', () =>
    expect(swameeJain(1e5, 1e-4)).toBeCloseTo(0.018452424431901808, 14));
});

describe('cooling calculator — Q = ṁ·c_p·ΔT and Darcy–Weisbach (REFERENCES.md §5 formulas, derived)', () => {
  it('1000 W into 2 L/min water at 20 °C; 10 mm bore, 3 m; hot spot through 0.05 K/W', () => {
    const r = runCalculator('cooling', {
      heat_W: 1000,
      flow_lpm: 2,
      coolant: 'water',
      inlet_C: 20,
      thermalResistance_KperW: 0.05,
      pipeBore_mm: 10,
      pipeLength_m: 3,
      roughness_mm: 0.0015,
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    // properties at the mean temperature
    const p = coolantProperties('water', 20 + o.coolantRise_K / 2);
    const q = 2 / 60000;
    expect(o.coolantRise_K).toBeCloseTo(1000 / (p.density_kgm3 * q * p.cp_JkgK), 4);
    expect(o.coolantRise_K).toBeGreaterThan(7.1);
    expect(o.coolantRise_K).toBeLessThan(7.2);
    expect(o.hotspot_C).toBeCloseTo(o.outlet_C + 1000 * 0.05, 10);
    const U = q / ((Math.PI * 0.01 ** 2) / 4);
    const re = (p.density_kgm3 * U * 0.01) / p.viscosity_Pas;
    expect(o.reynolds).toBeCloseTo(re, 6);
    expect(o.pressureDrop_Pa).toBeCloseTo((colebrook(re, 0.00015) * (3 / 0.01) * p.density_kgm3 * U * U) / 2, 6);
  });
});

// ASHRAE Handbook—Fundamentals ch. 31, ethylene glycol density by volume, via Viega Design Manual Table 5-16 (published).
describe('50 % (vol) ethylene glycol density — ASHRAE Fundamentals ch. 31 via Viega Table 5-16 (published)', () => {
  it('68 °F → 20 °C: between the 60 °F (67.20) and 70 °F (67.05 lb/ft³) entries', () => {
    const rho = coolantProperties('glycol50', 20).density_kgm3;
    expect(rho).toBeCloseTo((67.2 + 0.8 * (67.05 - 67.2)) * 16.01846337, 6);
  });
  it('100 °F (37.78 °C) → 66.55 lb/ft³ = 1066.03 kg/m³', () => {
    expect(coolantProperties('glycol50', (100 - 32) / 1.8).density_kgm3).toBeCloseTo(66.55 * 16.01846337, 6);
  });
  it('specific heat is flagged as memory in the calculator warnings (memory)', () => {
    const r = runCalculator('cooling', { coolant: 'glycol50' });
    if (!r.ok) throw new Error(JSON.stringify(r));
    expect(r.result.warnings.join(' ')).toMatch(/rule of thumb/);
    expect(r.result.warnings.join(' ')).not.toMatch(/memory/);
  });
});
