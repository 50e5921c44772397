import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { burrillLimit, projectedAreaRatio } from '../../src/lib/calc/cavitation';
import { saturationPressureIF97, seawaterVapourRatio, vapourPressure } from '../../src/lib/calc/properties/vapour';

// Cavitation checks of the propeller kind (also used by race, sprint and propeller-sweep).
// Sources: IAPWS R7-97(2012) (saturation pressure); M.H. Sharqawy, J.H. Lienhard V & S.M. Zubair (2010),
// Desalination and Water Treatment 16, 354–380, Eq. 6 (seawater vapour pressure); L.C. Burrill (1943), Trans. IESS 86,
// and L.C. Burrill & A. Emerson (1963), Trans. NECIES 79 (cavitation diagram, τ_c and A_P/A_D = 1.067 − 0.229·P/D);
// J. auf'm Keller (1966), Schip en Werf 33 (minimum blade area), both as given in J. Carlton, "Marine Propellers and
// Propulsion". The 5 % back-cavitation line is the logarithmic fit τ_c = 0.1082·ln σ + 0.2675 (0.16 ≤ σ ≤ 1.5)
// published in the open-source heliceb-automation tool (L. Lombardi, cavitation.py); it was not re-checked against the
// printed diagram (not at hand): a value from that implementation, not a chart reading.

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('vapour pressure — IAPWS-IF97 region 4 (IAPWS R7-97(2012), Table 35 verification values, published)', () => {
  it.each([
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ])('T = %s K → p_s = %s MPa (to the table’s 9 significant digits)', (T, pMPa) => {
    expect(rel(saturationPressureIF97(T), pMPa * 1e6)).toBeLessThan(5e-9);
  });

  // Independent implementation: python3-iapws 1.5.3 (J.J. Gómez Romera), IAPWS95._Vapor_Pressure, the auxiliary
  // saturation-pressure equation of W. Wagner & A. Pruß (2002), J. Phys. Chem. Ref. Data 31(2), Eq. 2.5.
  it.each([
    [10, 1228.11215089361],
    [15, 1705.677000368174],
    [20, 2339.193736622755],
    [25, 3169.8244863139726],
    [40, 7385.110474686082],
  ])('%s °C agrees with the IAPWS-95 saturation line of python3-iapws to 1e-4', (tC, p) => {
    expect(rel(vapourPressure(tC, 'fresh'), p)).toBeLessThan(1e-4);
  });

  it('seawater is lower by Sharqawy et al. (2010) Eq. 6: 1/(1 + 0.57357·S/(1000 − S)) at S 35.16504 g/kg (derived)', () => {
    // 0.9795233316003864 computed independently in Python from the same equation
    expect(seawaterVapourRatio(35.16504)).toBeCloseTo(0.9795233316003864, 14);
    expect(vapourPressure(20, 'sea') / vapourPressure(20, 'fresh')).toBeCloseTo(0.9795233316003864, 12);
  });

  it('rises with temperature (physical sanity)', () => {
    for (let t = 0; t < 40; t++) expect(vapourPressure(t + 1, 'fresh')).toBeGreaterThan(vapourPressure(t, 'fresh'));
  });
});

describe('Burrill line and projected area (Burrill 1943; Burrill & Emerson 1963; fit from heliceb-automation)', () => {
  it('the 5 % line at σ 0.5 and 1.0 is the fit’s 0.1082·ln σ + 0.2675 (value of that implementation)', () => {
    expect(burrillLimit(1)).toBeCloseTo(0.2675, 12);
    expect(burrillLimit(0.5)).toBeCloseTo(0.1082 * Math.log(0.5) + 0.2675, 12);
  });

  it('rises with σ inside the fit’s range and is held at its σ = 1.5 value above it (conservative)', () => {
    for (let s = 0.16; s < 1.5; s += 0.01) expect(burrillLimit(s + 0.01)).toBeGreaterThan(burrillLimit(s));
    expect(burrillLimit(3)).toBe(burrillLimit(1.5));
    expect(burrillLimit(0.05)).toBe(0);
  });

  it('A_P/A_D = 1.067 − 0.229·P/D (Burrill, as given in Carlton): 0.838 at P/D 1.0', () => {
    expect(projectedAreaRatio(1)).toBeCloseTo(0.838, 12);
  });
});

// REFERENCES.md §1 dimensional example (B4-70, P/D 1.0, D 0.20 m, 1200 rpm, V_A 2.0 m/s, fresh water 20 °C, T 173.1499 N)
// with the shaft 0.30 m deep. σ, τ_c and Keller's A_E/A_0 computed independently in Python (python3-iapws 1.5.3 IF97
// saturation pressure 2339.2148 Pa, g = 9.80665 m/s², p_atm 101,325 Pa) from the formulas of the sources above (derived).
const B4_70 = {
  blades: 4,
  bladeAreaRatio: 0.7,
  pitchRatio: 1.0,
  diameter_m: 0.2,
  rpm: 1200,
  speed_mps: 2.0,
  wakeFraction: 0,
  temperature_C: 20,
  water: 'fresh',
  shaftDepth_m: 0.3,
  kellerK: 0.2,
};

function outputs(kind: string, inputs: object) {
  const r = runCalculator(kind, inputs);
  if (!r.ok) throw new Error(JSON.stringify(r));
  return { o: r.result.outputs as Record<string, number & string>, warnings: r.result.warnings };
}

describe('propeller: cavitation outputs on the REFERENCES §1 example (derived, independent Python arithmetic)', () => {
  it('σ₀.₇R 2.509424, τ_c 0.231331, Keller minimum 0.306177; Burrill limit held at σ = 1.5', () => {
    const { o, warnings } = outputs('propeller', B4_70);
    expect(rel(o.cavitationNumber, 2.509423895841278)).toBeLessThan(1e-5);
    expect(rel(o.thrustLoadingCoefficient, 0.23133122183800203)).toBeLessThan(1e-5);
    expect(rel(o.kellerMinBladeAreaRatio, 0.3061774207147363)).toBeLessThan(1e-5);
    expect(o.burrillLimit).toBeCloseTo(0.1082 * Math.log(1.5) + 0.2675, 12);
    expect(o.burrillLine).toBe('5 % back cavitation');
    expect(warnings.some((w) => w.startsWith('Cavitation'))).toBe(false);
  });

  it('the sweep’s old sprint pick at its old scoring point (P/D 0.7, A_E/A_0 0.35, 4,300 rpm, 1 m/s) fails both criteria, as issue 15 says', () => {
    const { o, warnings } = outputs('propeller', {
      ...B4_70,
      blades: 3,
      bladeAreaRatio: 0.35,
      pitchRatio: 0.7,
      rpm: 4300,
      speed_mps: 1,
    });
    expect(o.thrustLoadingCoefficient).toBeGreaterThan(o.burrillLimit);
    expect(o.kellerMinBladeAreaRatio).toBeGreaterThan(0.35);
    expect(warnings.filter((w) => w.startsWith('Cavitation'))).toHaveLength(2);
  });

  it('physical sanity: more rpm lowers σ and raises τ_c; a deeper shaft raises σ and lowers Keller’s minimum', () => {
    const at = (over: object) => outputs('propeller', { ...B4_70, ...over }).o;
    const slow = at({ rpm: 1200 });
    const fast = at({ rpm: 2400 });
    expect(fast.cavitationNumber).toBeLessThan(slow.cavitationNumber);
    expect(fast.thrustLoadingCoefficient).toBeGreaterThan(slow.thrustLoadingCoefficient);
    const deep = at({ rpm: 2400, shaftDepth_m: 2 });
    expect(deep.cavitationNumber).toBeGreaterThan(fast.cavitationNumber);
    expect(deep.kellerMinBladeAreaRatio).toBeLessThan(fast.kellerMinBladeAreaRatio);
    // Keller's k is added as is
    expect(at({ kellerK: 0.1 }).kellerMinBladeAreaRatio).toBeCloseTo(slow.kellerMinBladeAreaRatio - 0.1, 12);
  });
});
