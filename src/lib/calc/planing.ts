// Savitsky's (1964) method for a prismatic planing hull, in the short form where thrust, friction and weight all
// act through the centre of gravity: the equilibrium trim is the one that puts the centre of pressure of the
// planing lift at the centre of gravity. Friction uses the ITTC-1957 line (the paper used Schoenherr's line with a
// roughness allowance; see the sources).
import { z } from 'zod';
import { CAUTION_DEFER, CAUTION_PROPELLER, CAUTION_WATER } from './cautions';
import { OutOfRangeError } from './errors';
import { num, objectSchema } from './fields';
import { brent, linspace } from './numeric';
import { waterProperties, type WaterKind } from './properties/water';
import { ittc57 } from './resistance';
import { SRC_ITTC57, SRC_ITTC_WATER, SRC_SAVITSKY64 } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';
import { temperatureInput, waterInput } from './water';

export const G = 9.80665;
const DEG = Math.PI / 180;

export interface PlaningInput {
  mass_kg: number;
  beam_m: number;
  lcg_m: number;
  deadrise_deg: number;
  speed_mps: number;
  temperature_C: number;
  water: WaterKind;
  appendageDragArea_m2: number;
}

export type PlaningOutput = {
  trim_deg: number;
  meanWettedLengthBeamRatio: number;
  speedCoefficient: number;
  liftCoefficient: number;
  resistance_N: number;
  effectivePower_W: number;
};

/** Ranges Savitsky (1964) gives for the lift and centre-of-pressure equations. */
export const SAVITSKY_RANGE = { cvMin: 0.6, cvMax: 13, trimMin: 2, trimMax: 15, lambdaMax: 4, deadriseMax: 30 };

const inputs: InputMeta[] = [
  num({
    name: 'mass_kg',
    label: 'Mass (boat and crew)',
    unit: 'kg',
    min: 1,
    max: 100000,
    step: 1,
    default: 220,
    group: 'Hull',
    help: 'Everything the hull carries: boat, batteries, driver, ballast (demo default 220 kg).',
  }),
  num({
    name: 'beam_m',
    label: 'Chine beam b',
    unit: 'm',
    min: 0.1,
    max: 10,
    step: 0.01,
    default: 0.9,
    group: 'Hull',
    help: 'Beam between the chines of the planing bottom (demo default 0.9 m).',
  }),
  num({
    name: 'lcg_m',
    label: 'LCG from transom',
    unit: 'm',
    min: 0.05,
    max: 40,
    step: 0.01,
    default: 1.7,
    group: 'Hull',
    help: 'Longitudinal centre of gravity measured forward from the transom (demo default 1.7 m).',
  }),
  num({
    name: 'deadrise_deg',
    label: 'Deadrise β',
    unit: '°',
    min: 0,
    max: 40,
    step: 0.5,
    default: 12,
    group: 'Hull',
    help: 'Deadrise angle of the bottom (constant over the wetted length for a prismatic hull). The method was fitted to 0–30°.',
  }),
  num({
    name: 'appendageDragArea_m2',
    label: 'Appendage drag area C_D·A',
    unit: 'm²',
    min: 0,
    max: 1,
    step: 0.0005,
    default: 0,
    group: 'Hull',
    help: 'Drag coefficient × area for pod, strut, rudder and fins, added as ½ρV²·C_D·A.',
  }),
  num({
    name: 'speed_mps',
    label: 'Boat speed V',
    unit: 'm/s',
    min: 0.1,
    max: 40,
    step: 0.1,
    default: 8,
    group: 'Speed',
    help: 'Boat speed through the water (demo default 8 m/s).',
  }),
  temperatureInput('Water'),
  waterInput('Water'),
];

/** Savitsky Eq. (16): lift of a deadrise surface from the zero-deadrise coefficient, β in degrees. */
export function liftWithDeadrise(cl0: number, betaDeg: number): number {
  return cl0 - 0.0065 * betaDeg * Math.pow(cl0, 0.6);
}

/** Inverse of Eq. (16): the zero-deadrise lift coefficient that gives C_Lβ. */
export function zeroDeadriseLift(clBeta: number, betaDeg: number): number {
  if (betaDeg === 0) return clBeta;
  // C_Lβ(C_L0) is increasing wherever the deadrise term has not swamped the lift (C_L0 above a small threshold).
  const f = (cl0: number) => liftWithDeadrise(cl0, betaDeg) - clBeta;
  let hi = Math.max(clBeta, 1e-6) * 2 + 0.1;
  while (f(hi) < 0) hi *= 2;
  const lo = Math.pow(0.6 * 0.0065 * betaDeg, 2.5); // d/dC_L0 = 0 here: below it C_Lβ decreases
  return brent(f, lo, hi, 1e-15);
}

/** Savitsky Eq. (15) divided by τ^1.1: C_L0/τ^1.1 = 0.0120 λ^½ + 0.0055 λ^(5/2)/C_V² (τ in degrees). */
export function liftPerTrim(lambda: number, cv: number): number {
  return 0.012 * Math.sqrt(lambda) + (0.0055 * Math.pow(lambda, 2.5)) / (cv * cv);
}

/** λ that satisfies Eq. (15) for a given C_L0, trim (degrees) and speed coefficient. */
export function wettedLengthBeamRatio(cl0: number, trimDeg: number, cv: number): number {
  const target = cl0 / Math.pow(trimDeg, 1.1);
  let hi = 1;
  while (liftPerTrim(hi, cv) < target) hi *= 2;
  return brent((l) => liftPerTrim(l, cv) - target, 0, hi, 1e-14);
}

/** Savitsky Eq. (31): centre of pressure forward of the transom as a fraction of the mean wetted length. */
export function centreOfPressureRatio(lambda: number, cv: number): number {
  return 0.75 - 1 / ((5.21 * cv * cv) / (lambda * lambda) + 2.39);
}

export interface PlaningState {
  trim_deg: number;
  lambda: number;
  cv: number;
  clBeta: number;
  cl0: number;
  /** mean bottom velocity V₁ */
  bottomSpeed_mps: number;
  reynolds: number;
  cf: number;
  friction_N: number;
  /** centre of pressure forward of the transom */
  lp_m: number;
  /** Δ·tan τ + D_f / cos τ (Savitsky's short-form drag, thrust along the keel) */
  hullResistance_N: number;
}

export interface PlaningHull {
  mass_kg: number;
  beam_m: number;
  deadrise_deg: number;
}

/**
 * Every quantity of Savitsky's computation at one trim angle: λ from the lift equations, the mean bottom
 * velocity V₁ = V·√(1 − 0.0120 τ^1.1/(λ^½ cos τ)), friction on the wetted bottom λb²/cos β, the centre of
 * pressure and the drag Δ tan τ + D_f/cos τ. `cf` may be given (e.g. to reproduce a worked example's
 * friction coefficient); otherwise the ITTC-1957 line at Re = V₁λb/ν.
 */
export function planingAtTrim(
  hull: PlaningHull,
  V: number,
  trimDeg: number,
  rho: number,
  nu: number,
  cfGiven?: number,
): PlaningState {
  const b = hull.beam_m;
  const weight = hull.mass_kg * G;
  const cv = V / Math.sqrt(G * b);
  const clBeta = weight / (0.5 * rho * V * V * b * b);
  const cl0 = zeroDeadriseLift(clBeta, hull.deadrise_deg);
  const lambda = wettedLengthBeamRatio(cl0, trimDeg, cv);
  const tau = trimDeg * DEG;
  const dynamic = (0.012 * Math.pow(trimDeg, 1.1)) / (Math.sqrt(lambda) * Math.cos(tau));
  const V1 = V * Math.sqrt(Math.max(0, 1 - dynamic));
  const reynolds = (V1 * lambda * b) / nu;
  const cf = cfGiven ?? ittc57(Math.max(reynolds, 1e3));
  const friction = (0.5 * rho * V1 * V1 * lambda * b * b * cf) / Math.cos(hull.deadrise_deg * DEG);
  const lp = centreOfPressureRatio(lambda, cv) * lambda * b;
  return {
    trim_deg: trimDeg,
    lambda,
    cv,
    clBeta,
    cl0,
    bottomSpeed_mps: V1,
    reynolds,
    cf,
    friction_N: friction,
    lp_m: lp,
    hullResistance_N: weight * Math.tan(tau) + friction / Math.cos(tau),
  };
}

const TRIM_SEARCH: [number, number] = [0.2, 30];

/** Equilibrium trim: the centre of pressure at the centre of gravity (all forces through the CG). */
export function planingEquilibrium(
  hull: PlaningHull & { lcg_m: number },
  V: number,
  rho: number,
  nu: number,
): PlaningState | null {
  const gap = (t: number) => planingAtTrim(hull, V, t, rho, nu).lp_m - hull.lcg_m;
  const [lo, hi] = TRIM_SEARCH;
  const gLo = gap(lo);
  const gHi = gap(hi);
  // l_p falls as trim rises (a shorter wetted length at a steeper trim carries the same weight).
  if (!(gLo >= 0 && gHi <= 0)) return null;
  const trim = brent(gap, lo, hi, 1e-10);
  return planingAtTrim(hull, V, trim, rho, nu);
}

export const planingCalculator: Calculator<PlaningInput, PlaningOutput> = {
  kind: 'planing',
  title: 'Planing hull (Savitsky)',
  summary:
    'Equilibrium trim, wetted length, lift coefficient and resistance of a prismatic planing hull by Savitsky’s method, with thrust and friction through the centre of gravity, and a resistance curve against speed.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<PlaningInput>,
  inputs,
  outputs: [
    { name: 'trim_deg', label: 'Equilibrium trim τ', unit: '°', digits: 2 },
    {
      name: 'meanWettedLengthBeamRatio',
      label: 'Mean wetted length / beam λ',
      unit: '',
      digits: 3,
      help: 'Mean of keel and chine wetted lengths over the chine beam.',
    },
    { name: 'speedCoefficient', label: 'Speed coefficient C_V', unit: '', digits: 3, help: 'V/√(g·b)' },
    {
      name: 'liftCoefficient',
      label: 'Lift coefficient C_Lβ',
      unit: '',
      digits: 4,
      help: 'Weight / (½ρV²b²): the lift the bottom must give at this speed.',
    },
    {
      name: 'resistance_N',
      label: 'Resistance R',
      unit: 'N',
      digits: 1,
      help: 'Δ·tan τ + D_f/cos τ plus appendage drag (thrust along the keel, through the centre of gravity).',
    },
    { name: 'effectivePower_W', label: 'Effective power P_E', unit: 'W', digits: 0, help: 'P_E = R·V' },
  ],
  sources: [SRC_SAVITSKY64, SRC_ITTC57, SRC_ITTC_WATER],
  cautions: [CAUTION_WATER, CAUTION_PROPELLER, CAUTION_DEFER],
  compute(input) {
    const w = waterProperties(input.temperature_C, input.water);
    const rho = w.density_kgm3;
    const nu = w.kinematicViscosity_m2s;
    const V = input.speed_mps;
    const cv = V / Math.sqrt(G * input.beam_m);
    if (cv < SAVITSKY_RANGE.cvMin || cv > SAVITSKY_RANGE.cvMax)
      throw new OutOfRangeError(
        'speed_mps',
        `Speed coefficient C_V = ${cv.toFixed(2)} is outside 0.60–13, the range of Savitsky’s lift equation; below it the hull is not planing (use the hull resistance calculator).`,
      );
    const eq = planingEquilibrium(input, V, rho, nu);
    if (!eq)
      throw new OutOfRangeError(
        'lcg_m',
        'No trim between 0.2° and 30° puts the centre of pressure at this centre of gravity: check the LCG against the beam and load.',
      );
    const appendage = (V: number) => 0.5 * rho * V * V * input.appendageDragArea_m2;
    const R = eq.hullResistance_N + appendage(V);
    const warnings: string[] = [];
    if (eq.trim_deg < SAVITSKY_RANGE.trimMin || eq.trim_deg > SAVITSKY_RANGE.trimMax)
      warnings.push(
        `Trim ${eq.trim_deg.toFixed(1)}° is outside 2–15°, the trims Savitsky’s equations were fitted to: treat the result as an extrapolation.`,
      );
    if (eq.lambda > SAVITSKY_RANGE.lambdaMax)
      warnings.push(
        `Mean wetted length ${eq.lambda.toFixed(2)} beams is above 4, where Savitsky’s lift equation was not fitted: the hull is barely planing at this speed.`,
      );
    if (input.deadrise_deg > SAVITSKY_RANGE.deadriseMax)
      warnings.push(`Deadrise above 30° is outside the data Savitsky’s deadrise correction was fitted to.`);
    warnings.push(
      'Prismatic hull in calm water with all forces through the centre of gravity: no spray drag, no air drag, no porpoising check and no hump (pre-planing) resistance.',
    );

    // Speeds where the short form has an equilibrium (the chart leaves out the rest).
    const curve = linspace(Math.max(0.6 * Math.sqrt(G * input.beam_m), 0.4 * V), 1.5 * V, 31).flatMap((v) => {
      const s = planingEquilibrium(input, v, rho, nu);
      return s ? [{ v, R: s.hullResistance_N + appendage(v), trim: s.trim_deg }] : [];
    });
    const speeds = curve.map((p) => p.v);
    const series: SeriesSet = {
      title: 'Resistance and effective power against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [
        { name: 'resistance_N', label: 'Resistance', unit: 'N', values: curve.map((p) => p.R) },
        { name: 'effectivePower_W', label: 'Effective power', unit: 'W', values: curve.map((p) => p.R * p.v) },
      ],
    };
    const trimSeries: SeriesSet = {
      title: 'Equilibrium trim against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [{ name: 'trim_deg', label: 'Trim', unit: '°', values: curve.map((p) => p.trim) }],
    };
    return {
      outputs: {
        trim_deg: eq.trim_deg,
        meanWettedLengthBeamRatio: eq.lambda,
        speedCoefficient: eq.cv,
        liftCoefficient: eq.clBeta,
        resistance_N: R,
        effectivePower_W: R * V,
      },
      series: { resistance: series, trim: trimSeries },
      warnings,
    };
  },
};
