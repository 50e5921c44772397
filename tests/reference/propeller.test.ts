import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { bSeries, cubic, openWaterEfficiency, polynomial } from '../../src/lib/calc/bseries';
import { KQ_TERMS, KT_TERMS } from '../../src/lib/calc/data/wageningen-b';

// Sources (REFERENCES.md §1): M.W.C. Oosterveld & P. van Oossanen (1975), "Further computer-analyzed data of the
// Wageningen B-screw series", Int. Shipbuilding Progress 22(251), Table 5; M.M. Bernitsas, D. Ray & P. Kinley
// (1981), "K_T, K_Q and efficiency curves for the Wageningen B-series propellers", Univ. of Michigan Report 237, Table 1.

function readCsv(name: string): number[][] {
  const text = readFileSync(join(__dirname, '..', 'fixtures', name), 'utf8')
    .trim()
    .split('\n')
    .slice(1);
  return text.map((line) => line.split(',').map(Number));
}

describe('B-series coefficient data equals the reference CSVs (Oosterveld & van Oossanen 1975, Table 5)', () => {
  for (const [name, terms, count] of [
    ['wageningen-b-kt.csv', KT_TERMS, 39],
    ['wageningen-b-kq.csv', KQ_TERMS, 47],
  ] as const) {
    it(`${name}: ${count} rows, identical coefficient and exponents`, () => {
      const rows = readCsv(name);
      expect(rows).toHaveLength(count);
      expect(terms).toHaveLength(count);
      rows.forEach(([term, C, s, t, u, v], i) => {
        expect(term).toBe(i + 1);
        expect(terms[i]).toEqual([C, s, t, u, v]);
      });
    });
  }

  // REFERENCES.md §1 data-file integrity sums (derived).
  it('Σ C_i and Σ|C_i| match REFERENCES.md §1 (derived)', () => {
    const sum = (ts: readonly (readonly number[])[]) => ts.reduce((a, r) => a + r[0], 0);
    const abs = (ts: readonly (readonly number[])[]) => ts.reduce((a, r) => a + Math.abs(r[0]), 0);
    expect(sum(KT_TERMS)).toBeCloseTo(-0.0337731941, 10);
    expect(sum(KQ_TERMS)).toBeCloseTo(0.0098693749, 10);
    expect(abs(KT_TERMS)).toBeCloseTo(2.3598490919, 10);
    expect(abs(KQ_TERMS)).toBeCloseTo(0.9169450425, 10);
  });

  it('K_Q term 28 is 0.00110903, not the misprint 0.0010903 (REFERENCES.md §1)', () => {
    expect(KQ_TERMS[27][0]).toBe(0.00110903);
  });
});

// Check values derived from the published polynomial, REFERENCES.md §1 table (derived); tolerances
// K_T 1e-6, K_Q 1e-7, η₀ 1e-6 absolute.
const TABLE = [
  { ae: 0.7, pd: 1.0, J: 0.0, kt: 0.454739, kq: 0.0675384, eta: 0 },
  { ae: 0.7, pd: 1.0, J: 0.3, kt: 0.354708, kq: 0.0545559, eta: 0.310435 },
  { ae: 0.7, pd: 1.0, J: 0.5, kt: 0.271033, kq: 0.0434326, eta: 0.496587 },
  { ae: 0.7, pd: 1.0, J: 0.7, kt: 0.178291, kq: 0.0307678, eta: 0.645583 },
  { ae: 0.55, pd: 1.0, J: 0.5, kt: 0.265249, kq: 0.0417838, eta: 0.505167 },
];

describe('B-series check values — Oosterveld & van Oossanen (1975) polynomial, REFERENCES.md §1 table (derived)', () => {
  for (const c of TABLE) {
    it(`B4-${c.ae * 100}, P/D ${c.pd}, J ${c.J}: K_T ${c.kt}, K_Q ${c.kq}, η₀ ${c.eta}`, () => {
      const p = bSeries(4, c.ae, c.pd);
      expect(Math.abs(cubic(p.kt, c.J) - c.kt)).toBeLessThanOrEqual(1e-6);
      expect(Math.abs(cubic(p.kq, c.J) - c.kq)).toBeLessThanOrEqual(1e-7);
      expect(Math.abs(openWaterEfficiency(p, c.J) - c.eta)).toBeLessThanOrEqual(1e-6);
      // the collapsed cubic equals the term-by-term polynomial
      expect(cubic(p.kt, c.J)).toBeCloseTo(polynomial(KT_TERMS, c.J, c.pd, c.ae, 4), 12);
      expect(cubic(p.kq, c.J)).toBeCloseTo(polynomial(KQ_TERMS, c.J, c.pd, c.ae, 4), 12);
    });
  }

  // Published chart reading (memory, ±0.02): B4-70 at P/D 1.0 crosses K_T = 0 near J ≈ 1.06, peak η₀ ≈ 0.69–0.70 near J ≈ 0.84.
  it('B4-70 P/D 1.0 chart shape: K_T = 0 near J 1.06, η₀ peak 0.69–0.70 near J 0.84 (chart reading, memory, ±0.02)', () => {
    const p = bSeries(4, 0.7, 1.0);
    expect(Math.abs(p.jZeroThrust - 1.06)).toBeLessThanOrEqual(0.02);
    let best = { J: 0, eta: 0 };
    for (let J = 0; J <= p.jZeroThrust; J += 0.001) {
      const eta = openWaterEfficiency(p, J);
      if (eta > best.eta) best = { J, eta };
    }
    expect(best.eta).toBeGreaterThanOrEqual(0.69 - 0.02);
    expect(best.eta).toBeLessThanOrEqual(0.7 + 0.02);
    expect(Math.abs(best.J - 0.84)).toBeLessThanOrEqual(0.02);
  });
});

describe('dimensional example — REFERENCES.md §1 (derived, relative 1e-5)', () => {
  it('B4-70, P/D 1.0, D 0.20 m, 1200 rpm, V_A 2.0 m/s, fresh 20 °C: J 0.5, T 173.1499 N, Q 5.54941 N·m, P_D 697.359 W, η₀ 0.496587', () => {
    const r = runCalculator('propeller', {
      blades: 4,
      bladeAreaRatio: 0.7,
      pitchRatio: 1.0,
      diameter_m: 0.2,
      rpm: 1200,
      speed_mps: 2.0,
      wakeFraction: 0,
      temperature_C: 20,
      water: 'fresh',
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
    expect(o.advanceRatio).toBeCloseTo(0.5, 12);
    expect(rel(o.thrust_N, 173.1499)).toBeLessThanOrEqual(1e-5);
    expect(rel(o.torque_Nm, 5.54941)).toBeLessThanOrEqual(1e-5);
    expect(rel(o.shaftPower_W, 697.359)).toBeLessThanOrEqual(1e-5);
    expect(rel(o.efficiency, 0.496587)).toBeLessThanOrEqual(1e-5);
  });
});
