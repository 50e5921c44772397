// Race operating point: the speed at which the propeller, turning at whatever rpm gives thrust·(1 − t) equal
// to the hull resistance, absorbs exactly the average shaft power the energy budget allows.
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
import { CAUTION_BATTERY } from './cautions';
import { energyBudget, energyInputs, type EnergyInput } from './energy';
import { OutOfRangeError } from './errors';
import { num, objectSchema } from './fields';
import { brent, linspace } from './numeric';
import { geometryInputs, propellerCautions, propellerSources, wakeInput, type PropellerGeometry } from './propeller';
import { waterProperties } from './properties/water';
import { hullInputs, hullResistance, resistanceSources, type HullInput } from './resistance';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface RaceInput extends HullInput, PropellerGeometry, EnergyInput {
  wakeFraction: number;
  thrustDeduction: number;
}

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

/** Speed at which the shaft power needed equals `power` (W); throws OutOfRangeError when none in SPEED_SEARCH. */
export function solveRaceSpeed(ctx: RaceContext, power: number, powerInput = 'batteryEnergy_Wh'): SelfPropulsionPoint {
  const [vLo, vHi] = SPEED_SEARCH;
  if (!(power > 0))
    throw new OutOfRangeError(powerInput, 'The energy budget gives no shaft power, so there is no operating point.');
  const pLo = selfPropulsion(ctx, vLo).shaftPower;
  if (pLo > power)
    throw new OutOfRangeError(
      powerInput,
      `The budget (${power.toFixed(0)} W at the shaft) is too small to push the boat even at ${vLo} m/s with this propeller.`,
    );
  const pHi = selfPropulsion(ctx, vHi).shaftPower;
  if (pHi < power)
    throw new OutOfRangeError(
      powerInput,
      `The budget (${power.toFixed(0)} W at the shaft) would drive the boat beyond ${vHi} m/s, outside this model; check the inputs.`,
    );
  const V = brent((v) => selfPropulsion(ctx, v).shaftPower - power, vLo, vHi, 1e-9);
  return selfPropulsion(ctx, V);
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

export const raceCalculator: Calculator<RaceInput, RaceOutput> = {
  kind: 'race',
  title: 'Race speed on the energy budget',
  summary:
    'The steady speed the energy budget sustains over the race with this hull and propeller: thrust·(1 − t) equals resistance and the shaft power equals the average the budget allows. Wave-making resistance is not included.',
  engineVersion: '1.0.0',
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
  ],
  sources: [...propellerSources, ...resistanceSources.filter((s) => !propellerSources.includes(s))],
  cautions: [...propellerCautions.slice(0, 2), CAUTION_BATTERY, propellerCautions[2]],
  compute(input) {
    const ctx = raceContext(input);
    const budget = energyBudget(input);
    const op = solveRaceSpeed(ctx, budget.averageShaftPower_W);
    const warnings: string[] = [];
    const cov = coverageWarning(input.blades, input.bladeAreaRatio);
    if (cov) warnings.push(cov);
    const vA = op.speed * (1 - input.wakeFraction);
    const rn = reynoldsWarning(reynolds075(ctx.prop, ctx.D, op.n, vA, ctx.nu));
    if (rn) warnings.push(rn);
    if (op.n * 60 > 6000)
      warnings.push(
        `The propeller would turn at ${(op.n * 60).toFixed(0)} rpm: check that the motor and gearing can reach it.`,
      );
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
      },
      series: { power: series },
      warnings,
    };
  },
};
