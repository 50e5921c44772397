// Propeller sweep: a grid of B-series propellers (P/D × A_E/A_0) for one hull, budget, diameter and blade
// number, scored for endurance (sustained race speed on the budget) and for sprint (thrust at a low speed at
// full power, limited by the maximum rpm).
import { z } from 'zod';
import { B_COVERAGE, B_RANGE, bSeries, checkBSeriesRange, cubic, type BSeriesPropeller } from './bseries';
import { CAUTION_BATTERY } from './cautions';
import { energyBudget, energyInputs, type EnergyInput } from './energy';
import { OutOfRangeError } from './errors';
import { int, num, objectSchema } from './fields';
import { brent, linspace } from './numeric';
import { propellerCautions, propellerSources, wakeInput } from './propeller';
import { raceContext, solveRaceSpeed, thrustDeductionInput } from './race';
import { hullInputs, resistanceSources, type HullInput } from './resistance';
import type { Calculator, Grid, InputMeta } from './types';

export interface SweepInput extends HullInput, EnergyInput {
  blades: number;
  diameter_m: number;
  wakeFraction: number;
  thrustDeduction: number;
  pitchRatioMin: number;
  pitchRatioMax: number;
  bladeAreaRatioMin?: number;
  bladeAreaRatioMax?: number;
  pitchSteps: number;
  areaSteps: number;
  sprintSpeed_mps: number;
  maxShaftPower_W: number;
  maxRpm: number;
}

export type SweepOutput = {
  bestEndurancePitchRatio: number | null;
  bestEnduranceBladeAreaRatio: number | null;
  bestEnduranceSpeed_mps: number | null;
  bestSprintPitchRatio: number | null;
  bestSprintBladeAreaRatio: number | null;
  bestSprintThrust_N: number | null;
  evaluated: number;
};

const P = 'Propellers';
const inputs: InputMeta[] = [
  ...hullInputs('Hull'),
  int({
    name: 'blades',
    label: 'Blades Z',
    unit: '',
    min: 1,
    max: 12,
    default: 3,
    group: P,
    help: 'Blade number of every propeller in the sweep (B-series: 2–7).',
  }),
  num({
    name: 'diameter_m',
    label: 'Diameter D',
    unit: 'm',
    min: 0.02,
    max: 3,
    step: 0.005,
    default: 0.2,
    group: P,
    help: 'Diameter of every propeller in the sweep (demo default 0.20 m).',
  }),
  wakeInput(P),
  thrustDeductionInput(P),
  num({
    name: 'pitchRatioMin',
    label: 'Lowest P/D',
    unit: '',
    min: 0.1,
    max: 3,
    step: 0.05,
    default: 0.6,
    group: P,
    help: 'Lower end of the pitch-ratio range (series: 0.5–1.4).',
  }),
  num({
    name: 'pitchRatioMax',
    label: 'Highest P/D',
    unit: '',
    min: 0.1,
    max: 3,
    step: 0.05,
    default: 1.4,
    group: P,
    help: 'Upper end of the pitch-ratio range.',
  }),
  num({
    name: 'bladeAreaRatioMin',
    label: 'Lowest A_E/A_0',
    unit: '',
    min: 0.05,
    max: 2,
    step: 0.01,
    optional: true,
    group: P,
    help: 'Leave empty for the lowest blade area tested for this blade number.',
  }),
  num({
    name: 'bladeAreaRatioMax',
    label: 'Highest A_E/A_0',
    unit: '',
    min: 0.05,
    max: 2,
    step: 0.01,
    optional: true,
    group: P,
    help: 'Leave empty for the highest blade area tested for this blade number.',
  }),
  int({
    name: 'pitchSteps',
    label: 'P/D steps',
    unit: '',
    min: 2,
    max: 40,
    default: 17,
    group: P,
    help: 'Number of pitch ratios in the grid.',
  }),
  int({
    name: 'areaSteps',
    label: 'A_E/A_0 steps',
    unit: '',
    min: 2,
    max: 30,
    default: 12,
    group: P,
    help: 'Number of blade-area ratios in the grid (17 × 12 ≈ 200 propellers by default).',
  }),
  ...energyInputs('Energy budget (endurance)'),
  num({
    name: 'sprintSpeed_mps',
    label: 'Sprint check speed',
    unit: 'm/s',
    min: 0.1,
    max: 20,
    step: 0.1,
    default: 1,
    group: 'Sprint',
    help: 'Low speed at which the sprint thrust is compared (e.g. just after the start).',
  }),
  num({
    name: 'maxShaftPower_W',
    label: 'Maximum shaft power',
    unit: 'W',
    min: 1,
    max: 500000,
    step: 10,
    default: 6000,
    group: 'Sprint',
    help: 'Peak shaft power the motor can give for a sprint (demo default 6 kW).',
  }),
  num({
    name: 'maxRpm',
    label: 'Maximum shaft speed',
    unit: 'rpm',
    min: 10,
    max: 20000,
    step: 10,
    default: 3000,
    group: 'Sprint',
    help: 'Highest propeller shaft speed the motor and gearing allow.',
  }),
];

const schema = objectSchema(inputs).superRefine((v, ctx) => {
  const o = v as Record<string, number | undefined>;
  if ((o.pitchRatioMin as number) > (o.pitchRatioMax as number))
    ctx.addIssue({ code: 'custom', path: ['pitchRatioMax'], message: 'Highest P/D must not be below the lowest.' });
  if (
    o.bladeAreaRatioMin !== undefined &&
    o.bladeAreaRatioMax !== undefined &&
    o.bladeAreaRatioMin > o.bladeAreaRatioMax
  )
    ctx.addIssue({
      code: 'custom',
      path: ['bladeAreaRatioMax'],
      message: 'Highest A_E/A_0 must not be below the lowest.',
    });
});

/** Thrust at speed vA (m/s) with shaft power ≤ maxPower and n ≤ nMax (rev/s). */
export function sprintThrust(
  p: BSeriesPropeller,
  D: number,
  vA: number,
  rho: number,
  maxPower: number,
  nMax: number,
): number {
  const power = (n: number) => 2 * Math.PI * rho * n ** 3 * D ** 5 * cubic(p.kq, vA / (n * D));
  const thrust = (n: number) => cubic(p.kt, vA / (n * D)) * rho * n * n * D ** 4;
  const nZero = vA / (p.jZeroThrust * D); // below this rpm the propeller gives no thrust
  if (nMax <= nZero) return 0;
  if (power(nMax) <= maxPower) return thrust(nMax);
  if (power(nZero) >= maxPower) return 0;
  return thrust(brent((n) => power(n) - maxPower, nZero, nMax, 1e-10));
}

function rangeFor(name: string, lo: number, hi: number, [min, max]: readonly [number, number], what: string): void {
  if (lo < min - 1e-12)
    throw new OutOfRangeError(name, `The B-series polynomials cover ${what} ${min}–${max}; ${lo} is outside.`);
  if (hi > max + 1e-12)
    throw new OutOfRangeError(
      name.replace('Min', 'Max'),
      `The B-series polynomials cover ${what} ${min}–${max}; ${hi} is outside.`,
    );
}

export const sweepCalculator: Calculator<SweepInput, SweepOutput> = {
  kind: 'propeller-sweep',
  title: 'Propeller sweep: endurance and sprint',
  summary:
    'Scores a grid of B-series propellers of one diameter and blade number: endurance by the speed the energy budget sustains, sprint by the thrust at a low speed at full power. Teams commonly run two propellers, one for sprint and one for endurance (common practice).',
  // 1.1.0: the grid marks the best cell of each objective.
  engineVersion: '1.1.0',
  inputSchema: schema as unknown as z.ZodType<SweepInput>,
  inputs,
  outputs: [
    { name: 'bestEndurancePitchRatio', label: 'Endurance: P/D', unit: '', digits: 3 },
    { name: 'bestEnduranceBladeAreaRatio', label: 'Endurance: A_E/A_0', unit: '', digits: 3 },
    { name: 'bestEnduranceSpeed_mps', label: 'Endurance: sustained speed', unit: 'm/s', digits: 2 },
    { name: 'bestSprintPitchRatio', label: 'Sprint: P/D', unit: '', digits: 3 },
    { name: 'bestSprintBladeAreaRatio', label: 'Sprint: A_E/A_0', unit: '', digits: 3 },
    {
      name: 'bestSprintThrust_N',
      label: 'Sprint: thrust',
      unit: 'N',
      digits: 1,
      help: 'Propeller thrust at the sprint check speed.',
    },
    { name: 'evaluated', label: 'Propellers evaluated', unit: '', digits: 0 },
  ],
  sources: [...propellerSources, ...resistanceSources],
  cautions: [...propellerCautions.slice(0, 2), CAUTION_BATTERY, propellerCautions[2]],
  compute(input) {
    const Z = input.blades;
    if (!Number.isInteger(Z) || Z < B_RANGE.blades[0] || Z > B_RANGE.blades[1])
      throw new OutOfRangeError(
        'blades',
        `The B-series polynomials cover ${B_RANGE.blades[0]} to ${B_RANGE.blades[1]} blades; ${Z} is outside.`,
      );
    const cov = B_COVERAGE[Z];
    const aLo = input.bladeAreaRatioMin ?? Math.max(cov[0], B_RANGE.bladeAreaRatio[0]);
    const aHi = input.bladeAreaRatioMax ?? Math.min(cov[1], B_RANGE.bladeAreaRatio[1]);
    rangeFor('pitchRatioMin', input.pitchRatioMin, input.pitchRatioMax, B_RANGE.pitchRatio, 'P/D');
    rangeFor('bladeAreaRatioMin', aLo, aHi, B_RANGE.bladeAreaRatio, 'A_E/A_0');
    if (aLo > aHi) throw new OutOfRangeError('bladeAreaRatioMin', `Lowest A_E/A_0 ${aLo} is above the highest ${aHi}.`);
    const pitches = linspace(input.pitchRatioMin, input.pitchRatioMax, input.pitchSteps);
    const areas = linspace(aLo, aHi, input.areaSteps);
    const budget = energyBudget(input);
    const warnings: string[] = [];
    if (aLo < cov[0] - 1e-12 || aHi > cov[1] + 1e-12)
      warnings.push(
        `Part of the blade-area range lies outside the areas tested for ${Z} blades (${cov[0]}–${cov[1]}); those propellers are extrapolated.`,
      );
    const base = raceContext({ ...input, bladeAreaRatio: areas[0], pitchRatio: pitches[0] });
    const vASprint = input.sprintSpeed_mps * (1 - input.wakeFraction);
    const nMax = input.maxRpm / 60;

    const z: (number | null)[][] = [];
    let bestE: { pd: number; ae: number; v: number } | null = null;
    let bestS: { pd: number; ae: number; t: number } | null = null;
    let evaluated = 0;
    let failed = 0;
    for (const pd of pitches) {
      const row: (number | null)[] = [];
      for (const ae of areas) {
        checkBSeriesRange(Z, ae, pd);
        const prop = bSeries(Z, ae, pd);
        evaluated++;
        let v: number | null = null;
        try {
          v = solveRaceSpeed({ ...base, prop }, budget.averageShaftPower_W).speed;
        } catch (e) {
          if (!(e instanceof OutOfRangeError)) throw e;
          failed++;
        }
        row.push(v);
        if (v !== null && (bestE === null || v > bestE.v)) bestE = { pd, ae, v };
        const t = sprintThrust(prop, input.diameter_m, vASprint, base.rho, input.maxShaftPower_W, nMax);
        if (bestS === null || t > bestS.t) bestS = { pd, ae, t };
      }
      z.push(row);
    }
    if (bestE === null)
      throw new OutOfRangeError(
        'batteryEnergy_Wh',
        'No propeller in the grid has an operating point on this energy budget.',
      );
    if (failed > 0)
      warnings.push(`${failed} of ${evaluated} propellers have no operating point on this budget (empty cells).`);
    if (bestS !== null && bestS.t <= 0)
      warnings.push('No propeller gives thrust at the sprint speed within the power and rpm limits.');
    const edge = (v: number, lo: number, hi: number) => Math.abs(v - lo) < 1e-12 || Math.abs(v - hi) < 1e-12;
    if (edge(bestE.pd, pitches[0], pitches[pitches.length - 1]) || edge(bestE.ae, areas[0], areas[areas.length - 1]))
      warnings.push(
        'The best endurance propeller lies on the edge of the grid: the optimum may be outside the range swept.',
      );
    warnings.push(
      'Cavitation and ventilation are not modelled; a heavily loaded sprint propeller close to the surface can lose much of this thrust.',
    );
    warnings.push(
      'Below Rn₀.₇₅ = 2·10⁶ (usual for student propellers) the series polynomials are uncorrected; compare propellers with each other rather than trusting absolute values.',
    );
    const grid: Grid = {
      title: 'Sustained race speed by pitch ratio and blade-area ratio',
      x: { name: 'bladeAreaRatio', label: 'A_E/A_0', unit: '', values: areas },
      y: { name: 'pitchRatio', label: 'P/D', unit: '', values: pitches },
      z: { name: 'speed_mps', label: 'Sustained speed', unit: 'm/s', values: z },
      marks: [
        { x: bestE.ae, y: bestE.pd, label: 'Best for endurance (highest sustained speed)', symbol: 'E' },
        ...(bestS && bestS.t > 0
          ? [{ x: bestS.ae, y: bestS.pd, label: 'Best for sprint (most thrust at the check speed)', symbol: 'S' }]
          : []),
      ],
    };
    return {
      outputs: {
        bestEndurancePitchRatio: bestE.pd,
        bestEnduranceBladeAreaRatio: bestE.ae,
        bestEnduranceSpeed_mps: bestE.v,
        bestSprintPitchRatio: bestS && bestS.t > 0 ? bestS.pd : null,
        bestSprintBladeAreaRatio: bestS && bestS.t > 0 ? bestS.ae : null,
        bestSprintThrust_N: bestS ? bestS.t : null,
        evaluated,
      },
      grid,
      warnings,
    };
  },
};
