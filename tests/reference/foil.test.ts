import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { cavitationNumber, helmboldSlope, inducedDragCoefficient } from '../../src/lib/calc/foil';
import { saturationPressureIF97 as saturationPressure } from '../../src/lib/calc/properties/vapour';

const G = 9.80665;
const run = (raw: Record<string, unknown>) => {
  const r = runCalculator('foil', raw);
  if (!r.ok) throw new Error(JSON.stringify(r));
  return r.result;
};
const out = (raw: Record<string, unknown>) => run(raw).outputs as Record<string, number>;

// H.B. Helmbold (1942), "Der unverwundene Ellipsenflügel als tragende Wirbelfläche", Jahrbuch der Deutschen
// Luftfahrtforschung: a = 2πA/(2 + √(A² + 4)); the form D.P. Raymer, "Aircraft Design: A Conceptual Approach",
// gives for an unswept wing at low Mach number. Values derived from the formula (regression vectors).
describe('Helmbold lift-curve slope (Helmbold 1942; Raymer; derived)', () => {
  it('A 6 → 37.6991/(2 + √40) = 4.528664 /rad', () => expect(helmboldSlope(6)).toBeCloseTo(4.528664, 6));
  it('A 8 → 4.905763 /rad', () => expect(helmboldSlope(8)).toBeCloseTo(4.905763, 6));
  it('large aspect ratio tends to the thin-aerofoil 2π /rad (Glauert, thin-aerofoil theory)', () =>
    expect(helmboldSlope(1e6) / (2 * Math.PI)).toBeCloseTo(1, 5));
  it('small aspect ratio tends to slender-wing πA/2 (R.T. Jones 1946, NACA Report 835)', () =>
    expect(helmboldSlope(0.001) / ((Math.PI * 0.001) / 2)).toBeCloseTo(1, 5));
  it('at high A it agrees with elliptic lifting line 2π/(1 + 2/A) (Prandtl; Anderson, Fundamentals of Aerodynamics ch. 5) to 1 % at A 20', () =>
    expect(Math.abs(helmboldSlope(20) / ((2 * Math.PI) / (1 + 2 / 20)) - 1)).toBeLessThan(0.01));
  it('rises monotonically with aspect ratio', () => {
    let prev = 0;
    for (let A = 0.5; A < 40; A += 0.5) {
      expect(helmboldSlope(A)).toBeGreaterThan(prev);
      prev = helmboldSlope(A);
    }
  });
});

// L. Prandtl lifting-line induced drag C_Di = C_L²/(π e A) (Anderson, "Fundamentals of Aerodynamics", ch. 5; derived).
describe('induced drag (lifting-line theory; derived)', () => {
  it('C_L 0.5, A 8, e 0.9 → 0.25/(7.2π) = 0.0110524', () =>
    expect(inducedDragCoefficient(0.5, 8, 0.9)).toBeCloseTo(0.25 / (7.2 * Math.PI), 12));
});

// IAPWS R7-97(2012) IF97, Eq. 30 saturation pressure, Table 35 check values (published).
describe('vapour pressure — IAPWS-IF97 Table 35 (published)', () => {
  it('300 K → 0.353658941·10⁻² MPa', () => expect(saturationPressure(300) / 1e6).toBeCloseTo(0.353658941e-2, 11));
  it('500 K → 0.263889776·10¹ MPa', () => expect(saturationPressure(500) / 1e6).toBeCloseTo(0.263889776e1, 7));
  it('600 K → 0.123443146·10² MPa', () => expect(saturationPressure(600) / 1e6).toBeCloseTo(0.123443146e2, 6));
});

describe('foil calculator — chains the formulas (derived) and behaves physically', () => {
  it('default foil: C_L = a(α − α₀), lift = ½ρV²S·C_L, drag = ½ρV²S(c_d + C_Di)', () => {
    const o = out({});
    const rho = out({}).lift_N / (0.5 * 49 * 0.2 * o.liftCoefficient);
    expect(rho).toBeCloseTo(998.2071, 2); // ITTC 7.5-02-01-03 fresh water at 20 °C
    expect(o.liftCoefficient).toBeCloseTo(helmboldSlope(8) * 5 * (Math.PI / 180), 12);
    const q = 0.5 * rho * 49;
    expect(o.inducedDrag_N).toBeCloseTo(q * 0.2 * inducedDragCoefficient(o.liftCoefficient, 8, 0.9), 9);
    expect(o.drag_N).toBeCloseTo(q * 0.2 * (0.008 + inducedDragCoefficient(o.liftCoefficient, 8, 0.9)), 9);
    expect(o.liftToDrag).toBeCloseTo(o.lift_N / o.drag_N, 12);
  });
  it('at the take-off speed lift equals the supported weight', () => {
    const t = out({ mass_kg: 150 }).takeOffSpeed_mps;
    expect(out({ mass_kg: 150, speed_mps: t }).lift_N).toBeCloseTo(150 * G, 6);
  });
  it('lift grows with V², and a heavier boat needs a higher take-off speed (∝ √m)', () => {
    expect(out({ speed_mps: 10 }).lift_N / out({ speed_mps: 5 }).lift_N).toBeCloseTo(4, 12);
    expect(out({ mass_kg: 400 }).takeOffSpeed_mps / out({ mass_kg: 100 }).takeOffSpeed_mps).toBeCloseTo(2, 12);
  });
  it('no lift at the zero-lift angle: no take-off speed and a warning', () => {
    const r = run({ angleOfAttack_deg: -2 });
    expect(r.outputs.takeOffSpeed_mps).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/no lift/);
  });
  it('cavitation number (p_atm + ρgh − p_v)/(½ρV²) falls with speed; the warning appears above the inception speed', () => {
    const o = out({});
    expect(o.cavitationNumber).toBeCloseTo(cavitationNumber(998.2071, 0.4, saturationPressure(293.15), 7), 3);
    const vc = o.cavitationSpeed_mps;
    expect(out({ speed_mps: vc }).cavitationNumber).toBeCloseTo(0.8, 9);
    expect(run({ speed_mps: vc * 0.98 }).warnings.join(' ')).not.toMatch(/cavitates/);
    expect(run({ speed_mps: vc * 1.02 }).warnings.join(' ')).toMatch(/cavitates/);
    expect(out({ depth_m: 1 }).cavitationSpeed_mps).toBeGreaterThan(vc);
  });
  it('says what it leaves out, and warns near the surface', () => {
    expect(run({}).warnings.join(' ')).toMatch(/free-surface and strut effects/);
    expect(run({ depth_m: 0.05 }).warnings.join(' ')).toMatch(/ventilate/);
  });
  it('series: lift, supported weight and drag against speed, lift crossing the weight near the take-off speed', () => {
    const r = run({});
    const s = r.series!.forces;
    expect(s.y.map((y) => y.name)).toEqual(['lift_N', 'weight_N', 'drag_N']);
    const lift = s.y[0].values;
    for (let i = 1; i < lift.length; i++) expect(lift[i]).toBeGreaterThan(lift[i - 1]);
    expect(Math.max(...s.x.values)).toBeGreaterThan(r.outputs.takeOffSpeed_mps as number);
  });
});
