// Standing-start sprint: m·dv/dt = T(v)·(1 − t) − R(v), the propeller turning at the highest rpm the motor's
// envelope allows at each speed (rpm, torque or power limit). Integrated with fourth-order Runge–Kutta steps
// sized to the acceleration; the finish and the 90 %-of-top-speed point are found inside a step by cubic
// Hermite interpolation.
import { z } from 'zod';
import { coverageWarning, cubic } from './bseries';
import {
  cavitationCheck,
  cavitationEnv,
  cavitationInputs,
  cavitationOutputs,
  cavitationOutputValues,
  cavitationWarnings,
  type CavitationCheck,
  type CavitationEnv,
  type CavitationInput,
} from './cavitation';
import { OutOfRangeError } from './errors';
import { num, objectSchema } from './fields';
import { allowedRevs, envelopeInputs, type EnvelopeLimit, type MotorEnvelope } from './motor';
import { brent, linspace } from './numeric';
import { geometryInputs, wakeInput, type PropellerGeometry } from './propeller';
import {
  raceContext,
  SPEED_SEARCH,
  thrustDeductionInput,
  type RaceContext,
  propulsionCautions,
  propulsionSources,
} from './race';
import { hullInputs, hullResistance, type HullInput } from './resistance';
import { SRC_QUADRATIC_DRAG } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface SprintInput extends HullInput, PropellerGeometry, MotorEnvelope, CavitationInput {
  wakeFraction: number;
  thrustDeduction: number;
  mass_kg: number;
  distance_m: number;
}

export type SprintOutput = {
  time_s: number;
  topSpeed_mps: number;
  distanceTo90pct_m: number;
  timeTo90pct_s: number;
  averageSpeed_mps: number;
  startThrust_N: number;
  topSpeedRpm: number;
  limitedBy: EnvelopeLimit;
  cavitationNumber: number;
  thrustLoadingCoefficient: number;
  burrillLimit: number;
  burrillLine: string;
  kellerMinBladeAreaRatio: number;
};

export const massInput = (group = 'Sprint'): InputMeta =>
  num({
    name: 'mass_kg',
    label: 'Mass (boat and driver)',
    unit: 'kg',
    min: 1,
    max: 20000,
    step: 1,
    default: 250,
    group,
    help: 'Everything that accelerates: hull, batteries, motor and driver (demo default 250 kg). Added mass of the water is not included.',
  });

export const distanceInput = (group = 'Sprint'): InputMeta =>
  num({
    name: 'distance_m',
    label: 'Sprint distance',
    unit: 'm',
    min: 10,
    max: 5000,
    step: 10,
    default: 200,
    group,
    help: 'Length of the sprint from a standing start (demo default 200 m).',
  });

const inputs: InputMeta[] = [
  ...hullInputs('Hull'),
  massInput('Sprint'),
  distanceInput('Sprint'),
  ...geometryInputs('Propeller'),
  wakeInput('Propeller'),
  thrustDeductionInput('Propeller'),
  ...envelopeInputs('Motor'),
  ...cavitationInputs('Cavitation'),
];

export interface SprintContext {
  race: RaceContext;
  mass: number;
  env: MotorEnvelope;
}

export interface ThrustAt {
  thrust: number;
  n: number;
  limitedBy: EnvelopeLimit;
  resistance: number;
}

/** Thrust the propeller gives at boat speed v (m/s) at the highest rpm the envelope allows, and the resistance. */
export function thrustAt(ctx: SprintContext, v: number): ThrustAt {
  const r = ctx.race;
  const vA = v * (1 - r.wake);
  const { n, limitedBy } = allowedRevs(r.prop, r.D, vA, r.rho, ctx.env);
  const J = n > 0 ? vA / (n * r.D) : 0;
  // beyond the zero-thrust advance ratio the cubic is outside the series and may turn up again: no thrust there
  const kt = J < r.prop.jZeroThrust ? cubic(r.prop.kt, J) : 0;
  return {
    thrust: Math.max(0, kt * r.rho * n * n * r.D ** 4),
    n,
    limitedBy,
    resistance: hullResistance(r.hull, v, r.rho, r.nu).total_N,
  };
}

function netForce(ctx: SprintContext, v: number): number {
  const f = thrustAt(ctx, v);
  return f.thrust * (1 - ctx.race.thrustDeduction) - f.resistance;
}

/** Top speed: where T·(1 − t) = R. Throws OutOfRangeError when it lies beyond the speeds this model covers. */
export function sprintTopSpeed(ctx: SprintContext): number {
  const vHi = SPEED_SEARCH[1];
  if (netForce(ctx, vHi) > 0)
    throw new OutOfRangeError(
      'maxShaftPower_W',
      `With this motor and propeller the boat would pass ${vHi} m/s, outside this model; check the inputs.`,
    );
  return brent((v) => netForce(ctx, v), 0, vHi, 1e-10);
}

export interface StandingStart {
  time_s: number;
  timeTo90pct_s: number;
  distanceTo90pct_m: number;
  t: number[];
  v: number[];
  x: number[];
}

const h00 = (s: number) => (1 + 2 * s) * (1 - s) * (1 - s);
const h10 = (s: number) => s * (1 - s) * (1 - s);
const h01 = (s: number) => s * s * (3 - 2 * s);
const h11 = (s: number) => s * s * (s - 1);

/** Fraction s ∈ [0, 1] of a step at which a monotone cubic Hermite (f0, f1, slopes d0·h, d1·h) reaches target. */
function hermiteCrossing(f0: number, f1: number, d0h: number, d1h: number, target: number): number {
  const f = (s: number) => h00(s) * f0 + h10(s) * d0h + h01(s) * f1 + h11(s) * d1h;
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 50; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Once v is this close to the top speed the rest of the distance is covered at v (relative error below 1e-6). */
const CRUISE = 1 - 1e-6;

/**
 * Integrates dv/dt = accel(v), dx/dt = v from rest (RK4, steps sized so that v changes by about 2 % of the top
 * speed, and no longer than the time constant of the approach to the top speed, which keeps the steps stable)
 * until the boat has covered `distance` and reached 90 % of vTop.
 */
export function integrateStandingStart(accel: (v: number) => number, vTop: number, distance: number): StandingStart {
  const v90 = 0.9 * vTop;
  const dvStep = 0.02 * vTop;
  // time constant near the top speed: 1/λ with λ = −da/dv, from the slope between 0.95·vTop and vTop
  const lambda = accel(0.95 * vTop) / (0.05 * vTop);
  const hMax = Math.min(2, lambda > 0 ? 1 / lambda : 2);
  let t = 0;
  let v = 0;
  let x = 0;
  let a0 = accel(0);
  let time: number | null = null;
  let t90: number | null = null;
  let x90: number | null = null;
  const ts = [0];
  const vs = [0];
  const xs = [0];
  for (let i = 0; i < 200000 && (time === null || t90 === null); i++) {
    if (t90 !== null && v >= CRUISE * vTop) {
      time = t + (distance - x) / v;
      break;
    }
    const h = Math.min(Math.max(dvStep / Math.max(a0, 1e-12), 1e-4 * hMax), hMax);
    const k2 = accel(v + 0.5 * h * a0);
    const k3 = accel(v + 0.5 * h * k2);
    const k4 = accel(v + h * k3);
    const v1 = v + (h / 6) * (a0 + 2 * k2 + 2 * k3 + k4);
    const x1 = x + (h / 6) * (v + 2 * (v + 0.5 * h * a0) + 2 * (v + 0.5 * h * k2) + (v + h * k3));
    const a1 = accel(v1);
    if (time === null && x1 >= distance) time = t + h * hermiteCrossing(x, x1, v * h, v1 * h, distance);
    if (t90 === null && v1 >= v90) {
      const s = hermiteCrossing(v, v1, a0 * h, a1 * h, v90);
      t90 = t + h * s;
      x90 = h00(s) * x + h10(s) * v * h + h01(s) * x1 + h11(s) * v1 * h;
    }
    t += h;
    v = v1;
    x = x1;
    a0 = a1;
    ts.push(t);
    vs.push(v);
    xs.push(x);
  }
  if (time === null || t90 === null || x90 === null) throw new Error('sprint integration did not finish');
  if (ts[ts.length - 1] < time) {
    ts.push(time);
    vs.push(v);
    xs.push(distance);
  }
  return { time_s: time, timeTo90pct_s: t90, distanceTo90pct_m: x90, t: ts, v: vs, x: xs };
}

export interface SprintRun extends StandingStart {
  topSpeed: number;
  topSpeedRevs: number;
  limitedBy: EnvelopeLimit;
  startThrust: number;
  startRevs: number;
}

/** The sprint of one propeller over `distance` (m). */
export function simulateSprint(ctx: SprintContext, distance: number): SprintRun {
  const vTop = sprintTopSpeed(ctx);
  const run = integrateStandingStart((v) => netForce(ctx, v) / ctx.mass, vTop, distance);
  const top = thrustAt(ctx, vTop);
  const start = thrustAt(ctx, 0);
  return {
    ...run,
    topSpeed: vTop,
    topSpeedRevs: top.n,
    limitedBy: top.limitedBy,
    startThrust: start.thrust,
    startRevs: start.n,
  };
}

/** Cavitation at the sprint's steady top speed (full power, the condition Burrill's diagram describes). */
export function sprintCavitation(ctx: SprintContext, run: SprintRun, env: CavitationEnv): CavitationCheck {
  const r = ctx.race;
  const f = thrustAt(ctx, run.topSpeed);
  return cavitationCheck(r.prop, r.D, f.n, run.topSpeed * (1 - r.wake), f.thrust, env);
}

export function sprintContext(
  input: SprintInput | (Omit<SprintInput, 'mass_kg' | 'distance_m'> & { mass_kg: number }),
): SprintContext {
  return {
    race: raceContext(input),
    mass: input.mass_kg,
    env: { maxShaftPower_W: input.maxShaftPower_W, maxRpm: input.maxRpm, maxTorque_Nm: input.maxTorque_Nm },
  };
}

export const sprintCalculator: Calculator<SprintInput, SprintOutput> = {
  kind: 'sprint',
  title: 'Sprint from a standing start',
  summary:
    'Time over the sprint distance from rest, with the propeller at the highest rpm the motor’s power, rpm and torque limits allow at each speed: m·dv/dt = T·(1 − t) − R. Top speed, distance to 90 % of it, and cavitation along the run. Wave-making resistance and added mass are not included.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<SprintInput>,
  inputs,
  outputs: [
    { name: 'time_s', label: 'Sprint time', unit: 's', digits: 2, help: 'From rest to the finish line.' },
    { name: 'topSpeed_mps', label: 'Top speed', unit: 'm/s', digits: 2, help: 'Where T·(1 − t) = R.' },
    { name: 'distanceTo90pct_m', label: 'Distance to 90 % of top speed', unit: 'm', digits: 1 },
    { name: 'timeTo90pct_s', label: 'Time to 90 % of top speed', unit: 's', digits: 2 },
    { name: 'averageSpeed_mps', label: 'Average speed over the sprint', unit: 'm/s', digits: 2 },
    { name: 'startThrust_N', label: 'Thrust at the start', unit: 'N', digits: 1 },
    { name: 'topSpeedRpm', label: 'Shaft speed at top speed', unit: 'rpm', digits: 0 },
    {
      name: 'limitedBy',
      label: 'Limited by (at top speed)',
      unit: '',
      digits: 0,
      help: 'Which of the motor’s limits sets the rpm at top speed: power, rpm or torque.',
    },
    ...cavitationOutputs('at top speed (steady full power)'),
  ],
  sources: [...propulsionSources, SRC_QUADRATIC_DRAG],
  cautions: propulsionCautions,
  compute(input) {
    const ctx = sprintContext(input);
    const cavEnv = cavitationEnv(input, ctx.race.rho);
    const run = simulateSprint(ctx, input.distance_m);
    const warnings: string[] = [];
    const cov = coverageWarning(input.blades, input.bladeAreaRatio);
    if (cov) warnings.push(cov);
    const check = sprintCavitation(ctx, run, cavEnv);
    warnings.push(...cavitationWarnings(check, input.bladeAreaRatio, 'at top speed'));
    const r = ctx.race;
    const atStart = cavitationCheck(r.prop, r.D, run.startRevs, 0, run.startThrust, cavEnv);
    if (check.burrillOk && check.kellerOk && (!atStart.burrillOk || !atStart.kellerOk))
      warnings.push(
        `At the start the propeller is far more heavily loaded (τ_c ${atStart.thrustLoadingCoefficient.toFixed(2)} against ${atStart.burrillLimit.toFixed(2)} on Burrill’s line): expect it to cavitate and lose some thrust for the first seconds, which this model does not include.`,
      );
    if (run.distanceTo90pct_m > input.distance_m)
      warnings.push(
        `The boat is still accelerating at the finish: it reaches 90 % of its top speed only after ${run.distanceTo90pct_m.toFixed(0)} m.`,
      );
    warnings.push(
      'The added mass of the water, wave-making resistance, trim changes and the motor’s and battery’s response time are left out: real sprints are somewhat slower; compare propellers with each other.',
    );
    // the run up to the finish line (the integration may go on to reach 90 % of top speed), ending on the line
    let last = run.t.findIndex((t) => t >= run.time_s);
    if (last < 1) last = run.t.length - 1;
    const f = (run.time_s - run.t[last - 1]) / (run.t[last] - run.t[last - 1]);
    const ts = [...run.t.slice(0, last), run.time_s];
    const vs = [...run.v.slice(0, last), run.v[last - 1] + f * (run.v[last] - run.v[last - 1])];
    const xs = [...run.x.slice(0, last), input.distance_m];
    const runSeries: SeriesSet = {
      title: 'Speed and distance against time',
      x: { name: 'time_s', label: 'Time', unit: 's', values: ts },
      y: [
        { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: vs },
        { name: 'distance_m', label: 'Distance', unit: 'm', values: xs },
      ],
    };
    const speeds = linspace(0, run.topSpeed * 1.1, 34);
    const forces = speeds.map((v) => thrustAt(ctx, v));
    const forceSeries: SeriesSet = {
      title: 'Useful thrust and resistance against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [
        {
          name: 'usefulThrust_N',
          label: 'Thrust·(1 − t) inside the envelope',
          unit: 'N',
          values: forces.map((f) => f.thrust * (1 - input.thrustDeduction)),
        },
        { name: 'resistance_N', label: 'Resistance', unit: 'N', values: forces.map((f) => f.resistance) },
      ],
    };
    return {
      outputs: {
        time_s: run.time_s,
        topSpeed_mps: run.topSpeed,
        distanceTo90pct_m: run.distanceTo90pct_m,
        timeTo90pct_s: run.timeTo90pct_s,
        averageSpeed_mps: input.distance_m / run.time_s,
        startThrust_N: run.startThrust,
        topSpeedRpm: run.topSpeedRevs * 60,
        limitedBy: run.limitedBy,
        ...cavitationOutputValues(check),
      },
      series: { run: runSeries, forces: forceSeries },
      warnings,
    };
  },
};
