// Propeller sweep: a grid of B-series propellers (P/D × A_E/A_0) for one hull, budget, diameter and blade
// number, scored for endurance (sustained race speed on the budget, inside the motor's envelope) and for sprint
// (time over the sprint distance from a standing start at full power inside the envelope). Propellers that fail
// Burrill's or Keller's cavitation criterion at the scored condition are greyed out and never picked while any
// propeller passes.
import { z } from 'zod';
import { B_COVERAGE, B_RANGE, bSeries, checkBSeriesRange } from './bseries';
import { cavitationCheck, cavitationEnv, cavitationInputs, type CavitationInput } from './cavitation';
import { energyBudget, energyInputs, type EnergyInput } from './energy';
import { OutOfRangeError } from './errors';
import { int, num, objectSchema } from './fields';
import { linspace } from './numeric';
import { wakeInput } from './propeller';
import { envelopeInputs, type MotorEnvelope } from './motor';
import { raceContext, solveEnvelopeSpeed, thrustDeductionInput, propulsionCautions, propulsionSources } from './race';
import { distanceInput, massInput, simulateSprint, sprintCavitation, thrustAt, type SprintContext } from './sprint';
import { hullInputs, type HullInput } from './resistance';
import type { Calculator, Grid, InputMeta } from './types';

export interface SweepInput extends HullInput, EnergyInput, MotorEnvelope, CavitationInput {
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
  mass_kg: number;
  distance_m: number;
}

export type SweepOutput = {
  bestEndurancePitchRatio: number | null;
  bestEnduranceBladeAreaRatio: number | null;
  bestEnduranceSpeed_mps: number | null;
  bestSprintPitchRatio: number | null;
  bestSprintBladeAreaRatio: number | null;
  bestSprintThrust_N: number | null;
  evaluated: number;
  enduranceBest: string | null;
  sprintBest: string | null;
  bestSprintTime_s: number | null;
  bestSprintTopSpeed_mps: number | null;
  enduranceLimitedBy: string | null;
  enduranceCavitationFailures: number;
  sprintCavitationFailures: number;
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
  massInput('Sprint'),
  distanceInput('Sprint'),
  num({
    name: 'sprintSpeed_mps',
    label: 'Sprint check speed',
    unit: 'm/s',
    min: 0.1,
    max: 20,
    step: 0.1,
    default: 1,
    group: 'Sprint',
    help: 'Low speed at which the sprint pick’s thrust is reported (e.g. just after the start); the sprint is scored by its time.',
  }),
  ...envelopeInputs('Motor'),
  ...cavitationInputs('Cavitation'),
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

function rangeFor(name: string, lo: number, hi: number, [min, max]: readonly [number, number], what: string): void {
  if (lo < min - 1e-12)
    throw new OutOfRangeError(name, `The B-series polynomials cover ${what} ${min}–${max}; ${lo} is outside.`);
  if (hi > max + 1e-12)
    throw new OutOfRangeError(
      name.replace('Min', 'Max'),
      `The B-series polynomials cover ${what} ${min}–${max}; ${hi} is outside.`,
    );
}

const name = (Z: number, ae: number, pd: number) => `B${Z}-${Math.round(ae * 100)}, P/D ${pd.toFixed(2)}`;

interface Cell {
  pd: number;
  ae: number;
  value: number;
}

/** Best passing cell (most of `value` when `higher`, else least), or the best of all when none passes. */
function pick(cells: (Cell & { ok: boolean })[], higher: boolean): { cell: Cell; passes: boolean } | null {
  const better = (a: Cell, b: Cell | null) => b === null || (higher ? a.value > b.value : a.value < b.value);
  let okBest: Cell | null = null;
  let anyBest: Cell | null = null;
  for (const c of cells) {
    if (better(c, anyBest)) anyBest = c;
    if (c.ok && better(c, okBest)) okBest = c;
  }
  if (okBest) return { cell: okBest, passes: true };
  return anyBest ? { cell: anyBest, passes: false } : null;
}

export const sweepCalculator: Calculator<SweepInput, SweepOutput> = {
  kind: 'propeller-sweep',
  title: 'Propeller sweep: endurance and sprint',
  summary:
    'Scores a grid of B-series propellers of one diameter and blade number: endurance by the speed the energy budget sustains, sprint by the time over the sprint distance from a standing start, both inside the motor’s power, rpm and torque limits. Propellers that fail Burrill’s or Keller’s cavitation criterion are greyed out. Teams commonly run two propellers, one for sprint and one for endurance (common practice).',
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
      label: 'Sprint: thrust at the check speed',
      unit: 'N',
      digits: 1,
      help: 'Thrust of the sprint pick at the sprint check speed, inside the motor’s limits.',
    },
    { name: 'evaluated', label: 'Propellers evaluated', unit: '', digits: 0 },
    {
      name: 'enduranceBest',
      label: 'Endurance pick',
      unit: '',
      digits: 0,
      help: 'Propeller with the highest sustained race speed among those passing the cavitation checks at the race point.',
    },
    {
      name: 'sprintBest',
      label: 'Sprint pick',
      unit: '',
      digits: 0,
      help: 'Propeller with the shortest sprint time among those passing the cavitation checks at top speed.',
    },
    { name: 'bestSprintTime_s', label: 'Sprint: time', unit: 's', digits: 2 },
    { name: 'bestSprintTopSpeed_mps', label: 'Sprint: top speed', unit: 'm/s', digits: 2 },
    {
      name: 'enduranceLimitedBy',
      label: 'Endurance pick limited by',
      unit: '',
      digits: 0,
      help: 'energy, or the motor limit (power, rpm, torque) that caps the endurance pick’s race speed.',
    },
    { name: 'enduranceCavitationFailures', label: 'Failing cavitation at the race point', unit: '', digits: 0 },
    { name: 'sprintCavitationFailures', label: 'Failing cavitation at sprint top speed', unit: '', digits: 0 },
  ],
  sources: propulsionSources,
  cautions: propulsionCautions,
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
    const env: MotorEnvelope = {
      maxShaftPower_W: input.maxShaftPower_W,
      maxRpm: input.maxRpm,
      maxTorque_Nm: input.maxTorque_Nm,
    };
    const cavEnv = cavitationEnv(input, base.rho);

    const zE: (number | null)[][] = [];
    const zS: (number | null)[][] = [];
    const failE: boolean[][] = [];
    const failS: boolean[][] = [];
    const cellsE: (Cell & { ok: boolean; limitedBy: string })[] = [];
    const cellsS: (Cell & { ok: boolean; topSpeed: number; ctx: SprintContext })[] = [];
    let evaluated = 0;
    let failed = 0;
    let sprintFailed = 0;
    for (const pd of pitches) {
      const rowE: (number | null)[] = [];
      const rowS: (number | null)[] = [];
      const rowFE: boolean[] = [];
      const rowFS: boolean[] = [];
      for (const ae of areas) {
        checkBSeriesRange(Z, ae, pd);
        const prop = bSeries(Z, ae, pd);
        const ctx = { ...base, prop };
        evaluated++;
        let v: number | null = null;
        let okE = true;
        try {
          const { op, limitedBy } = solveEnvelopeSpeed(ctx, budget.averageShaftPower_W, env);
          v = op.speed;
          const c = cavitationCheck(prop, input.diameter_m, op.n, v * (1 - input.wakeFraction), op.thrust, cavEnv);
          okE = c.burrillOk && c.kellerOk;
          cellsE.push({ pd, ae, value: v, ok: okE, limitedBy });
        } catch (e) {
          if (!(e instanceof OutOfRangeError)) throw e;
          failed++;
        }
        rowE.push(v);
        rowFE.push(v !== null && !okE);
        let time: number | null = null;
        let okS = true;
        const sctx: SprintContext = { race: ctx, mass: input.mass_kg, env };
        try {
          const run = simulateSprint(sctx, input.distance_m);
          time = run.time_s;
          const c = sprintCavitation(sctx, run, cavEnv);
          okS = c.burrillOk && c.kellerOk;
          cellsS.push({ pd, ae, value: time, ok: okS, topSpeed: run.topSpeed, ctx: sctx });
        } catch (e) {
          if (!(e instanceof OutOfRangeError)) throw e;
          sprintFailed++;
        }
        rowS.push(time);
        rowFS.push(time !== null && !okS);
      }
      zE.push(rowE);
      zS.push(rowS);
      failE.push(rowFE);
      failS.push(rowFS);
    }
    const bestE = pick(cellsE, true);
    if (bestE === null)
      throw new OutOfRangeError(
        'batteryEnergy_Wh',
        'No propeller in the grid has an operating point on this energy budget.',
      );
    const bestS = pick(cellsS, false);
    if (failed > 0)
      warnings.push(`${failed} of ${evaluated} propellers have no operating point on this budget (empty cells).`);
    if (sprintFailed > 0)
      warnings.push(
        `${sprintFailed} of ${evaluated} propellers have no sprint result within this model (empty cells).`,
      );
    const failuresE = cellsE.filter((c) => !c.ok).length;
    const failuresS = cellsS.filter((c) => !c.ok).length;
    if (!bestE.passes)
      warnings.push(
        'Every propeller with a race point fails a cavitation criterion there: the endurance pick is the fastest of them all; consider a larger diameter, more blade area or deeper immersion.',
      );
    if (bestS && !bestS.passes)
      warnings.push(
        'Every propeller fails a cavitation criterion at sprint top speed: the sprint pick is the quickest of them all and will lose thrust to cavitation.',
      );
    const edge = (c: Cell) =>
      Math.abs(c.pd - pitches[0]) < 1e-12 ||
      Math.abs(c.pd - pitches[pitches.length - 1]) < 1e-12 ||
      Math.abs(c.ae - areas[0]) < 1e-12 ||
      Math.abs(c.ae - areas[areas.length - 1]) < 1e-12;
    const eEdge = edge(bestE.cell);
    const sEdge = bestS ? edge(bestS.cell) : false;
    if (eEdge)
      warnings.push(
        'The best endurance propeller lies on the edge of the grid: the optimum may be outside the range swept.',
      );
    if (sEdge)
      warnings.push(
        'The best sprint propeller lies on the edge of the grid: the optimum may be outside the range swept.',
      );
    warnings.push(
      'Cavitation is screened with Burrill’s and Keller’s criteria only; ventilation from the surface is not modelled, and a heavily loaded propeller close to the surface can lose much of its thrust.',
    );
    warnings.push(
      'Below Rn₀.₇₅ = 2·10⁶ (usual for student propellers) the series polynomials are uncorrected; compare propellers with each other rather than trusting absolute values.',
    );
    const onEdge = (yes: boolean) => (yes ? ' (on the grid’s edge)' : '');
    const e = bestE.cell;
    const eLimited = cellsE.find((c) => c === e)?.limitedBy ?? null;
    const sCell = bestS ? cellsS.find((c) => c === bestS.cell) : undefined;
    const sprintThrustAtCheck = sCell !== undefined ? thrustAt(sCell.ctx, input.sprintSpeed_mps).thrust : null;
    const x = { name: 'bladeAreaRatio', label: 'A_E/A_0', unit: '', values: areas };
    const y = { name: 'pitchRatio', label: 'P/D', unit: '', values: pitches };
    const grid: Grid = {
      title: 'Sustained race speed by pitch ratio and blade-area ratio',
      x,
      y,
      z: { name: 'speed_mps', label: 'Sustained speed', unit: 'm/s', values: zE },
      failed: failE,
      failedLabel: 'fails a cavitation criterion at the race point',
      picks: [{ x: e.ae, y: e.pd, label: `endurance pick${onEdge(eEdge)}` }],
    };
    const sprintGrid: Grid = {
      title: `Sprint time over ${input.distance_m} m by pitch ratio and blade-area ratio`,
      x,
      y,
      z: { name: 'time_s', label: 'Sprint time', unit: 's', values: zS },
      failed: failS,
      failedLabel: 'fails a cavitation criterion at sprint top speed',
      picks: bestS ? [{ x: bestS.cell.ae, y: bestS.cell.pd, label: `sprint pick${onEdge(sEdge)}` }] : [],
    };
    return {
      outputs: {
        bestEndurancePitchRatio: e.pd,
        bestEnduranceBladeAreaRatio: e.ae,
        bestEnduranceSpeed_mps: e.value,
        bestSprintPitchRatio: bestS ? bestS.cell.pd : null,
        bestSprintBladeAreaRatio: bestS ? bestS.cell.ae : null,
        bestSprintThrust_N: sprintThrustAtCheck,
        evaluated,
        enduranceBest: `${name(Z, e.ae, e.pd)}: ${e.value.toFixed(2)} m/s${onEdge(eEdge)}`,
        sprintBest: bestS
          ? `${name(Z, bestS.cell.ae, bestS.cell.pd)}: ${bestS.cell.value.toFixed(2)} s over ${input.distance_m} m${onEdge(sEdge)}`
          : null,
        bestSprintTime_s: bestS ? bestS.cell.value : null,
        bestSprintTopSpeed_mps: sCell ? sCell.topSpeed : null,
        enduranceLimitedBy: eLimited,
        enduranceCavitationFailures: failuresE,
        sprintCavitationFailures: failuresS,
      },
      grid,
      grids: [sprintGrid],
      warnings,
    };
  },
};
