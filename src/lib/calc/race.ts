// Race operating point: the speed at which the propeller, turning at whatever rpm gives thrust·(1 − t) equal
// to the hull resistance, absorbs exactly the average shaft power the energy budget allows — or less, when the
// motor's envelope (power, rpm, torque) stops it first.
import { z } from 'zod';
import {
  advanceRatioForLoading,
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
import { CAUTION_BATTERY } from './cautions';
import { energyBudget, energyInputs, type EnergyInput } from './energy';
import { OutOfRangeError } from './errors';
import { num, objectSchema } from './fields';
import { envelopeInputs, type EnvelopeLimit, type MotorEnvelope } from './motor';
import { brent, linspace } from './numeric';
import { geometryInputs, propellerCautions, propellerSources, wakeInput, type PropellerGeometry } from './propeller';
import { waterProperties } from './properties/water';
import { hullInputs, hullResistance, resistanceSources, type HullInput } from './resistance';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface RaceInput extends HullInput, PropellerGeometry, EnergyInput, MotorEnvelope, CavitationInput {
  wakeFraction: number;
  thrustDeduction: number;
}

export type RaceLimit = 'energy' | EnvelopeLimit;

export type RaceOutput = {
  speed_mps: number;
  rpm: number;
  advanceRatio: number;
  thrust_N: number;
  resistance_N: number;
  torque_Nm: number;
  shaftPower_W: number;
  electricalPower_W: number;
  efficiency: number;
  limitedBy: RaceLimit;
  cavitationNumber: number;
  thrustLoadingCoefficient: number;
  burrillLimit: number;
  burrillLine: string;
  kellerMinBladeAreaRatio: number;
};

export const thrustDeductionInput = (group = 'Propeller'): InputMeta =>
  num({
    name: 'thrustDeduction',
    label: 'Thrust deduction t',
    unit: '',
    min: 0,
    max: 0.5,
    step: 0.01,
    default: 0,
    group,
    help: 'Share of thrust lost to the propeller’s suction on the hull: the useful thrust is T·(1 − t). Near 0 for a pod well clear of the hull.',
  });

export const raceInputs = (): InputMeta[] => [
  ...hullInputs('Hull'),
  ...geometryInputs('Propeller'),
  wakeInput('Propeller'),
  thrustDeductionInput('Propeller'),
  ...energyInputs('Energy budget'),
  ...envelopeInputs('Motor'),
  ...cavitationInputs('Cavitation'),
];

const inputs = raceInputs();

/** Speeds searched for the operating point, m/s. */
export const SPEED_SEARCH: [number, number] = [0.05, 30];

export interface RaceContext {
  hull: HullInput;
  prop: BSeriesPropeller;
  D: number;
  wake: number;
  thrustDeduction: number;
  rho: number;
  nu: number;
}

export interface SelfPropulsionPoint {
  speed: number;
  n: number;
  J: number;
  kt: number;
  kq: number;
  thrust: number;
  torque: number;
  shaftPower: number;
  resistance: number;
}

/** Self-propulsion at speed V: the rpm at which T·(1 − t) = R(V), and the shaft power it then takes. */
export function selfPropulsion(ctx: RaceContext, V: number): SelfPropulsionPoint {
  const R = hullResistance(ctx.hull, V, ctx.rho, ctx.nu).total_N;
  const vA = V * (1 - ctx.wake);
  const c = R / ((1 - ctx.thrustDeduction) * ctx.rho * ctx.D * ctx.D * vA * vA);
  const J = advanceRatioForLoading(ctx.prop, c);
  const n = vA / (J * ctx.D);
  const kt = cubic(ctx.prop.kt, J);
  const kq = cubic(ctx.prop.kq, J);
  const torque = kq * ctx.rho * n * n * ctx.D ** 5;
  return {
    speed: V,
    n,
    J,
    kt,
    kq,
    thrust: kt * ctx.rho * n * n * ctx.D ** 4,
    torque,
    shaftPower: 2 * Math.PI * n * torque,
    resistance: R,
  };
}

const LIMIT_INPUT: Record<EnvelopeLimit, keyof MotorEnvelope> = {
  power: 'maxShaftPower_W',
  rpm: 'maxRpm',
  torque: 'maxTorque_Nm',
};
const LIMIT_WHAT: Record<EnvelopeLimit, string> = { power: 'shaft power', rpm: 'shaft speed', torque: 'torque' };

function limitValue(p: SelfPropulsionPoint, limit: EnvelopeLimit): number {
  return limit === 'power' ? p.shaftPower : limit === 'rpm' ? p.n * 60 : p.torque;
}

/**
 * The race point inside the motor's envelope: the energy budget's speed, or lower where power, rpm or torque
 * reach the motor's limits first (all three rise with speed along the self-propulsion line).
 */
export function solveEnvelopeSpeed(
  ctx: RaceContext,
  power: number,
  env: MotorEnvelope,
): { op: SelfPropulsionPoint; limitedBy: RaceLimit; energySpeed: number | null } {
  const [vLo, vHi] = SPEED_SEARCH;
  if (!(power > 0))
    throw new OutOfRangeError(
      'batteryEnergy_Wh',
      'The energy budget gives no shaft power, so there is no operating point.',
    );
  const lo = selfPropulsion(ctx, vLo);
  if (lo.shaftPower > power)
    throw new OutOfRangeError(
      'batteryEnergy_Wh',
      `The budget (${power.toFixed(0)} W at the shaft) is too small to push the boat even at ${vLo} m/s with this propeller.`,
    );
  const limits: EnvelopeLimit[] = ['power', 'rpm', 'torque'];
  for (const l of limits)
    if (limitValue(lo, l) > env[LIMIT_INPUT[l]])
      throw new OutOfRangeError(
        LIMIT_INPUT[l],
        `The motor’s ${LIMIT_WHAT[l]} limit is reached below ${vLo} m/s with this propeller: raise it or choose another propeller.`,
      );
  const hi = selfPropulsion(ctx, vHi);
  let top = vHi;
  let limitedBy: RaceLimit | null = null;
  let energySpeed: number | null = null;
  if (hi.shaftPower >= power) {
    top = brent((v) => selfPropulsion(ctx, v).shaftPower - power, vLo, vHi, 1e-9);
    energySpeed = top;
    limitedBy = 'energy';
  }
  let atTop = limitedBy ? selfPropulsion(ctx, top) : hi;
  for (const l of limits) {
    const cap = env[LIMIT_INPUT[l]];
    if (limitValue(atTop, l) <= cap) continue;
    top = brent((v) => limitValue(selfPropulsion(ctx, v), l) - cap, vLo, top, 1e-9);
    atTop = selfPropulsion(ctx, top);
    limitedBy = l;
  }
  if (limitedBy === null)
    throw new OutOfRangeError(
      'batteryEnergy_Wh',
      `The budget (${power.toFixed(0)} W at the shaft) and the motor would drive the boat beyond ${vHi} m/s, outside this model; check the inputs.`,
    );
  return { op: atTop, limitedBy, energySpeed };
}

export function raceContext(
  input: HullInput & PropellerGeometry & { wakeFraction: number; thrustDeduction: number },
  prop?: BSeriesPropeller,
): RaceContext {
  const w = waterProperties(input.temperature_C, input.water);
  return {
    hull: input,
    prop: prop ?? bSeries(input.blades, input.bladeAreaRatio, input.pitchRatio),
    D: input.diameter_m,
    wake: input.wakeFraction,
    thrustDeduction: input.thrustDeduction,
    rho: w.density_kgm3,
    nu: w.kinematicViscosity_m2s,
  };
}

/** Sources and cautions shared by race, sprint and the sweep (propeller, hull, cavitation; battery power). */
export const propulsionSources = [
  ...propellerSources,
  ...resistanceSources.filter((s) => !propellerSources.includes(s)),
  ...cavitationSources,
];
export const propulsionCautions = [...propellerCautions.slice(0, 2), CAUTION_BATTERY, propellerCautions[2]];

export const raceCalculator: Calculator<RaceInput, RaceOutput> = {
  kind: 'race',
  title: 'Race speed on the energy budget',
  summary:
    'The steady speed the energy budget sustains over the race with this hull and propeller: thrust·(1 − t) equals resistance and the shaft power equals the average the budget allows, unless the motor’s power, rpm or torque limit stops it first. Cavitation is checked at that point. Wave-making resistance is not included.',
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<RaceInput>,
  inputs,
  outputs: [
    { name: 'speed_mps', label: 'Sustained speed', unit: 'm/s', digits: 2 },
    { name: 'rpm', label: 'Shaft speed', unit: 'rpm', digits: 0 },
    { name: 'advanceRatio', label: 'Advance ratio J', unit: '', digits: 3 },
    { name: 'thrust_N', label: 'Propeller thrust T', unit: 'N', digits: 1 },
    {
      name: 'resistance_N',
      label: 'Hull resistance R',
      unit: 'N',
      digits: 1,
      help: 'Equals T·(1 − t) at the operating point.',
    },
    { name: 'torque_Nm', label: 'Shaft torque', unit: 'N·m', digits: 2 },
    { name: 'shaftPower_W', label: 'Shaft power', unit: 'W', digits: 0 },
    {
      name: 'electricalPower_W',
      label: 'Electrical power',
      unit: 'W',
      digits: 0,
      help: 'Average battery + solar power over the race.',
    },
    { name: 'efficiency', label: 'Open-water efficiency η₀', unit: '', digits: 3 },
    {
      name: 'limitedBy',
      label: 'Limited by',
      unit: '',
      digits: 0,
      help: 'energy: the budget sets the speed; power, rpm or torque: the motor’s limit is reached first and energy is left over.',
    },
    ...cavitationOutputs('at the race point'),
  ],
  sources: propulsionSources,
  cautions: propulsionCautions,
  compute(input) {
    const ctx = raceContext(input);
    const budget = energyBudget(input);
    const { op, limitedBy, energySpeed } = solveEnvelopeSpeed(ctx, budget.averageShaftPower_W, input);
    const warnings: string[] = [];
    const cov = coverageWarning(input.blades, input.bladeAreaRatio);
    if (cov) warnings.push(cov);
    const vA = op.speed * (1 - input.wakeFraction);
    const rn = reynoldsWarning(reynolds075(ctx.prop, ctx.D, op.n, vA, ctx.nu));
    if (rn) warnings.push(rn);
    if (limitedBy !== 'energy')
      warnings.push(
        `The motor’s ${limitedBy} limit holds the boat to ${op.speed.toFixed(2)} m/s at ${op.shaftPower.toFixed(0)} W on the shaft${energySpeed ? `; the budget alone would allow ${energySpeed.toFixed(2)} m/s` : ''}: energy is left at the finish. A propeller of coarser pitch or larger diameter, or a different gear ratio, may use it.`,
      );
    const cav = cavitationCheck(ctx.prop, ctx.D, op.n, vA, op.thrust, cavitationEnv(input, ctx.rho));
    warnings.push(...cavitationWarnings(cav, input.bladeAreaRatio, 'at the race point'));
    const speeds = linspace(0.3 * op.speed, 1.3 * op.speed, 31);
    const need = speeds.map((v) => selfPropulsion(ctx, v).shaftPower);
    const series: SeriesSet = {
      title: 'Shaft power needed against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [
        { name: 'shaftPower_W', label: 'Shaft power needed', unit: 'W', values: need },
        {
          name: 'budget_W',
          label: 'Average shaft power on the budget',
          unit: 'W',
          values: speeds.map(() => budget.averageShaftPower_W),
        },
      ],
    };
    return {
      outputs: {
        speed_mps: op.speed,
        rpm: op.n * 60,
        advanceRatio: op.J,
        thrust_N: op.thrust,
        resistance_N: op.resistance,
        torque_Nm: op.torque,
        shaftPower_W: op.shaftPower,
        electricalPower_W: budget.averageElectricalPower_W,
        efficiency: openWaterEfficiency(ctx.prop, op.J),
        limitedBy,
        ...cavitationOutputValues(cav),
      },
      series: { power: series },
      warnings,
    };
  },
};
