import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { coolantProperties, glycolFreezingPoint, glycolProperties } from '../../src/lib/calc/coolant';
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

// ASHRAE Handbook—Fundamentals ch. 31, ethylene glycol density by volume, via Viega Design Manual Table 5-16
// (published). The `glycol50` alias now maps to Melinder's correlation at a mass fraction of 0.527 (a 50 % by volume mix
// before mixing); the mix contracts on mixing, so the by-volume table lies 0.1–1.2 % above it — an independent check
// of the alias, not an identity.
describe('50 % (vol) ethylene glycol density — ASHRAE Fundamentals ch. 31 via Viega Table 5-16 (published), within 1.2 %', () => {
  const rows = [
    [-20, 68.05],
    [20, 67.7],
    [60, 67.2],
    [100, 66.55],
    [140, 65.75],
    [180, 64.8],
  ];
  for (const [tF, lb] of rows)
    it(`${tF} °F → ${lb} lb/ft³`, () => {
      const rho = coolantProperties('glycol50', (tF - 32) / 1.8).density_kgm3;
      const table = lb * 16.01846337;
      expect(rho).toBeLessThan(table);
      expect((table - rho) / table).toBeLessThan(0.012);
    });
});

// Å. Melinder (2010), "Properties of Secondary Working Fluids for Indirect Systems", IIR — ethylene glycol correlation.
// Check values: the SecondaryCoolantProps library's test suite, tests/test_ethlylene_glycol.py (M. Mitchell et al., NREL),
// an independent implementation; its tolerance is 0.1 %, ours is 0.05 %.
describe('ethylene glycol–water — Melinder (2010) via SecondaryCoolantProps tests/test_ethlylene_glycol.py (published test vectors)', () => {
  const V = [
    // [mass fraction, °C, viscosity Pa·s, density kg/m³, specific heat J/(kg·K)]
    [0.2, 5, 2.6594e-3, 1.0281e3, 3.8695e3],
    [0.2, 20, 1.6624e-3, 1.0241e3, 3.8962e3],
    [0.2, 40, 1.0133e-3, 1.0164e3, 3.9328e3],
    [0.4, 5, 4.7569e-3, 1.0585e3, 3.4559e3],
    [0.4, 20, 2.8191e-3, 1.0519e3, 3.519e3],
    [0.4, 40, 1.6351e-3, 1.0414e3, 3.5978e3],
  ];
  for (const [x, t, mu, rho, cp] of V)
    it(`x ${x}, ${t} °C → μ ${mu}, ρ ${rho}, c_p ${cp}`, () => {
      const p = glycolProperties(x, t);
      expect(Math.abs(p.viscosity_Pas / mu - 1)).toBeLessThan(5e-4);
      expect(Math.abs(p.density_kgm3 / rho - 1)).toBeLessThan(5e-4);
      expect(Math.abs(p.cp_JkgK / cp - 1)).toBeLessThan(5e-4);
    });
  const F = [
    [0.1, -3.357],
    [0.2, -7.949],
    [0.3, -14.576],
    [0.4, -23.813],
    [0.5, -35.994],
    [0.6, -51.201],
  ];
  for (const [x, tf] of F)
    it(`freezing point at x ${x} → ${tf} °C`, () => expect(glycolFreezingPoint(x)).toBeCloseTo(tf, 2));
});

describe('cooling with a glycol fraction (Melinder 2010; physical sanity, derived)', () => {
  const run = (raw: Record<string, unknown>) => {
    const r = runCalculator('cooling', raw);
    if (!r.ok) throw new Error(JSON.stringify(r));
    return r.result.outputs as Record<string, number>;
  };
  it('more glycol → lower heat capacity → larger coolant rise, and higher viscosity → lower pipe Reynolds number', () => {
    const common = { heat_W: 2000, flow_lpm: 4, inlet_C: 20, pipeBore_mm: 10, pipeLength_m: 3 };
    const a = run({ ...common, coolant: 'glycol', glycolFraction: 0.2 });
    const b = run({ ...common, coolant: 'glycol', glycolFraction: 0.5 });
    const w = run({ ...common, coolant: 'water' });
    expect(w.coolantRise_K).toBeLessThan(a.coolantRise_K);
    expect(a.coolantRise_K).toBeLessThan(b.coolantRise_K);
    expect(w.reynolds).toBeGreaterThan(a.reynolds);
    expect(a.reynolds).toBeGreaterThan(b.reynolds);
  });
  it('glycol50 is the alias of glycol at a 0.527 mass fraction', () => {
    const common = { heat_W: 1500, flow_lpm: 3, inlet_C: 10, pipeBore_mm: 8, pipeLength_m: 2 };
    expect(run({ ...common, coolant: 'glycol50' })).toEqual(
      run({ ...common, coolant: 'glycol', glycolFraction: 0.527 }),
    );
  });
  it('an inlet below the mix’s freezing point is refused (422 out_of_range on inlet_C)', () => {
    const r = runCalculator('cooling', { coolant: 'glycol', glycolFraction: 0.2, inlet_C: -10 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r).toMatchObject({ error: 'out_of_range', input: 'inlet_C' });
    expect(runCalculator('cooling', { coolant: 'glycol', glycolFraction: 0.4, inlet_C: -10 }).ok).toBe(true);
  });
  it('a glycol fraction above 0.6 is invalid input', () => {
    const r = runCalculator('cooling', { coolant: 'glycol', glycolFraction: 0.7 });
    expect(r).toMatchObject({ ok: false, error: 'invalid_input' });
  });
});
