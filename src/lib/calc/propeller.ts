// Open-water performance of a Wageningen B-series propeller at one operating point, plus its open-water chart.
import { z } from 'zod';
import {
  bSeries,
  coverageWarning,
  cubic,
  openWaterEfficiency,
  reynolds075,
  reynoldsWarning,
  type BSeriesPropeller,
} from './bseries';
import {
  cavitationCheck,
  cavitationEnv,
  cavitationInputs,
  cavitationOutputs,
  cavitationOutputValues,
  cavitationSources,
  cavitationWarnings,
  type CavitationInput,
} from './cavitation';
import { CAUTION_DEFER, CAUTION_PROPELLER, CAUTION_WATER } from './cautions';
import { OutOfRangeError } from './errors';
import { int, num, objectSchema } from './fields';
import { linspace } from './numeric';
import { waterProperties, type WaterKind } from './properties/water';
import { SRC_BERNITSAS, SRC_HELMA, SRC_ITTC_WATER, SRC_OOSTERVELD } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';
import { temperatureInput, waterInput } from './water';

export interface PropellerGeometry {
  blades: number;
  bladeAreaRatio: number;
  pitchRatio: number;
  diameter_m: number;
}

export interface PropellerInput extends PropellerGeometry, CavitationInput {
  rpm: number;
  speed_mps: number;
  wakeFraction: number;
  temperature_C: number;
  water: WaterKind;
}

export type PropellerOutput = {
  advanceRatio: number;
  kt: number;
  kq: number;
  efficiency: number | null;
  thrust_N: number;
  torque_Nm: number;
  shaftPower_W: number;
  cavitationNumber: number;
  thrustLoadingCoefficient: number;
  burrillLimit: number;
  burrillLine: string;
  kellerMinBladeAreaRatio: number;
};

// Shared by race and propeller-sweep. Schema limits are generic; the B-series range is enforced in compute
// so that the API can say which input is outside the method (422) rather than "invalid form" (400).
export const geometryInputs = (group = 'Propeller'): InputMeta[] => [
  int({
    name: 'blades',
    label: 'Blades Z',
    unit: '',
    min: 1,
    max: 12,
    default: 3,
    group,
    help: 'Number of blades. The B-series covers 2–7.',
  }),
  num({
    name: 'bladeAreaRatio',
    label: 'Blade area ratio A_E/A_0',
    unit: '',
    min: 0.05,
    max: 2,
    step: 0.01,
    default: 0.5,
    group,
    help: 'Expanded blade area over disk area. The polynomials cover 0.30–1.05; tested models per blade number cover less (a warning says when).',
  }),
  num({
    name: 'pitchRatio',
    label: 'Pitch ratio P/D',
    unit: '',
    min: 0.1,
    max: 3,
    step: 0.01,
    default: 1.0,
    group,
    help: 'Pitch over diameter. The polynomials cover 0.5–1.4.',
  }),
  num({
    name: 'diameter_m',
    label: 'Diameter D',
    unit: 'm',
    min: 0.02,
    max: 3,
    step: 0.005,
    default: 0.2,
    group,
    help: 'Propeller diameter (demo default 0.20 m, typical of student boats).',
  }),
];

export const wakeInput = (group = 'Propeller'): InputMeta =>
  num({
    name: 'wakeFraction',
    label: 'Wake fraction w',
    unit: '',
    min: 0,
    max: 0.6,
    step: 0.01,
    default: 0,
    group,
    help: 'Taylor wake fraction: the propeller sees V_A = V·(1 − w). Near 0 for a pod ahead of the hull wake; measure or estimate for your layout.',
  });

const inputs: InputMeta[] = [
  ...geometryInputs(),
  num({
    name: 'rpm',
    label: 'Shaft speed',
    unit: 'rpm',
    min: 1,
    max: 20000,
    step: 10,
    default: 1500,
    group: 'Operating point',
    help: 'Propeller shaft speed (after any gearbox).',
  }),
  num({
    name: 'speed_mps',
    label: 'Boat speed V',
    unit: 'm/s',
    min: 0,
    max: 30,
    step: 0.1,
    default: 4,
    group: 'Operating point',
    help: 'Boat speed through the water (demo default 4 m/s).',
  }),
  wakeInput('Operating point'),
  temperatureInput('Water'),
  waterInput('Water'),
  ...cavitationInputs('Cavitation'),
];

/** Beyond about J = 2 the polynomials are far outside the measured range of any series member. */
const J_MAX = 2;
const TWO_PI = 2 * Math.PI;

export interface OperatingPoint {
  advanceRatio: number;
  kt: number;
  kq: number;
  efficiency: number;
  thrust_N: number;
  torque_Nm: number;
  shaftPower_W: number;
}

/** Thrust, torque and power of a propeller at n (rev/s) and V_A (m/s). */
export function operatingPoint(p: BSeriesPropeller, D: number, n: number, vA: number, rho: number): OperatingPoint {
  const J = vA / (n * D);
  const kt = cubic(p.kt, J);
  const kq = cubic(p.kq, J);
  const thrust = kt * rho * n * n * D ** 4;
  const torque = kq * rho * n * n * D ** 5;
  return {
    advanceRatio: J,
    kt,
    kq,
    efficiency: openWaterEfficiency(p, J),
    thrust_N: thrust,
    torque_Nm: torque,
    shaftPower_W: TWO_PI * n * torque,
  };
}

export function openWaterSeries(p: BSeriesPropeller, points = 41): SeriesSet {
  const js = linspace(0, p.jZeroThrust, points);
  return {
    title: `B${p.blades}-${Math.round(p.bladeAreaRatio * 100)}, P/D ${p.pitchRatio} open-water chart`,
    x: { name: 'advanceRatio', label: 'Advance ratio J', unit: '', values: js },
    y: [
      { name: 'kt', label: 'K_T', unit: '', values: js.map((j) => cubic(p.kt, j)) },
      { name: 'kq10', label: '10·K_Q', unit: '', values: js.map((j) => 10 * cubic(p.kq, j)) },
      { name: 'efficiency', label: 'η₀', unit: '', values: js.map((j) => openWaterEfficiency(p, j)) },
    ],
  };
}

export const propellerCautions = [CAUTION_PROPELLER, CAUTION_WATER, CAUTION_DEFER];
export const propellerSources = [SRC_OOSTERVELD, SRC_BERNITSAS, SRC_HELMA, SRC_ITTC_WATER];

export const propellerCalculator: Calculator<PropellerInput, PropellerOutput> = {
  kind: 'propeller',
  title: 'Propeller open-water performance',
  summary:
    'Thrust, torque, shaft power and efficiency of a Wageningen B-series propeller at one speed and shaft speed, with its open-water chart (K_T, 10·K_Q and η₀ against advance ratio), and Burrill’s and Keller’s cavitation checks at that point.',
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<PropellerInput>,
  inputs,
  outputs: [
    { name: 'advanceRatio', label: 'Advance ratio J', unit: '', digits: 3, help: 'J = V_A/(n·D), n in rev/s.' },
    { name: 'kt', label: 'Thrust coefficient K_T', unit: '', digits: 4 },
    { name: 'kq', label: 'Torque coefficient K_Q', unit: '', digits: 5 },
    {
      name: 'efficiency',
      label: 'Open-water efficiency η₀',
      unit: '',
      digits: 3,
      help: 'η₀ = J·K_T/(2π·K_Q); empty when the propeller gives no thrust.',
    },
    { name: 'thrust_N', label: 'Thrust T', unit: 'N', digits: 1 },
    { name: 'torque_Nm', label: 'Torque Q', unit: 'N·m', digits: 2 },
    {
      name: 'shaftPower_W',
      label: 'Shaft power P_D',
      unit: 'W',
      digits: 0,
      help: 'P_D = 2π·n·Q, delivered to the propeller.',
    },
    ...cavitationOutputs('at this operating point'),
  ],
  sources: [...propellerSources, ...cavitationSources],
  cautions: propellerCautions,
  compute(input) {
    const p = bSeries(input.blades, input.bladeAreaRatio, input.pitchRatio);
    const warnings: string[] = [];
    const cov = coverageWarning(input.blades, input.bladeAreaRatio);
    if (cov) warnings.push(cov);
    const water = waterProperties(input.temperature_C, input.water);
    const n = input.rpm / 60;
    const D = input.diameter_m;
    const vA = input.speed_mps * (1 - input.wakeFraction);
    const J = vA / (n * D);
    if (J > J_MAX)
      throw new OutOfRangeError(
        'rpm',
        `Advance ratio J = ${J.toFixed(2)} is far beyond where this propeller gives thrust (J ≈ ${p.jZeroThrust.toFixed(2)}); raise the shaft speed or lower the boat speed.`,
      );
    const op = operatingPoint(p, D, n, vA, water.density_kgm3);
    let efficiency: number | null = op.efficiency;
    if (op.kt <= 0) {
      efficiency = null;
      warnings.push(
        `At J = ${J.toFixed(2)} the propeller gives no thrust (K_T ≤ 0 beyond J ≈ ${p.jZeroThrust.toFixed(2)}): it is being dragged or windmilling.`,
      );
    }
    const rnWarn = reynoldsWarning(reynolds075(p, D, n, vA, water.kinematicViscosity_m2s));
    if (rnWarn) warnings.push(rnWarn);
    const cav = cavitationCheck(p, D, n, vA, op.thrust_N, cavitationEnv(input, water.density_kgm3));
    warnings.push(...cavitationWarnings(cav, input.bladeAreaRatio, 'at this operating point'));
    return {
      outputs: {
        advanceRatio: op.advanceRatio,
        kt: op.kt,
        kq: op.kq,
        efficiency,
        thrust_N: op.thrust_N,
        torque_Nm: op.torque_Nm,
        shaftPower_W: op.shaftPower_W,
        ...cavitationOutputValues(cav),
      },
      series: { openWater: openWaterSeries(p) },
      warnings,
    };
  },
};

/**
 * Actuator-disk (Rankine 1865, Froude 1889) ideal efficiency at thrust loading C_T = T/(½ρA·V_A²):
 * η_ideal = 2/(1 + √(1 + C_T)). No real propeller exceeds it.
 */
export function idealEfficiency(ct: number): number {
  return 2 / (1 + Math.sqrt(1 + ct));
}
