// Race energy budget: usable battery energy plus solar energy over the race, spread evenly over the race.
// Peukert's law is left out on purpose: it exists in two incompatible conventions and is small for
// lithium cells at race discharge rates; fold any capacity derating into the usable fraction instead.
import { z } from 'zod';
import { CAUTION_BATTERY, CAUTION_DEFER } from './cautions';
import { num, objectSchema } from './fields';
import { linspace } from './numeric';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface EnergyInput {
  batteryEnergy_Wh: number;
  usableFraction: number;
  raceDuration_h: number;
  solarPower_W: number;
  drivetrainEfficiency: number;
}

export type EnergyOutput = {
  availableEnergy_Wh: number;
  averageElectricalPower_W: number;
  averageShaftPower_W: number;
  averageCRate: number | null;
};

export interface EnergyCalcInput extends EnergyInput {
  maxCRate: number;
}

export const energyInputs = (group = 'Energy budget'): InputMeta[] => [
  num({
    name: 'batteryEnergy_Wh',
    label: 'Battery energy',
    unit: 'Wh',
    min: 0,
    max: 100000,
    step: 10,
    default: 1800,
    group,
    help: 'Nominal pack energy, V_nom × C_Ah (demo default 1.8 kWh; class rules usually cap it).',
  }),
  num({
    name: 'usableFraction',
    label: 'Usable fraction',
    unit: '',
    min: 0,
    max: 1,
    step: 0.01,
    default: 0.9,
    group,
    help: 'Share of the nominal energy you plan to use (depth of discharge, reserve, cold-cell derating).',
  }),
  num({
    name: 'raceDuration_h',
    label: 'Race duration',
    unit: 'h',
    min: 0.01,
    max: 48,
    step: 0.05,
    default: 2,
    group,
    help: 'Length of the race or heat the budget must last.',
  }),
  num({
    name: 'solarPower_W',
    label: 'Average solar power',
    unit: 'W',
    min: 0,
    max: 20000,
    step: 10,
    default: 250,
    group,
    help: 'Average array output over the race window (use the solar calculator for one condition).',
  }),
  num({
    name: 'drivetrainEfficiency',
    label: 'Drivetrain efficiency',
    unit: '',
    min: 0.05,
    max: 1,
    step: 0.01,
    default: 0.85,
    group,
    help: 'Battery-to-shaft efficiency: controller × motor × gearbox.',
  }),
];

// The C-rate limit is the energy calculator's own input (race and the sweep share energyInputs without it).
const inputs = [
  ...energyInputs(),
  num({
    name: 'maxCRate',
    label: 'Cell continuous C-rate limit',
    unit: '1/h',
    min: 0.01,
    max: 100,
    step: 0.1,
    default: 2,
    help: 'Highest continuous discharge rate the cells allow, in multiples of their capacity per hour (datasheet: maximum continuous current ÷ capacity; demo default 2 C). A warning shows when the budget’s average battery power needs more.',
  }),
];

export interface Budget {
  availableEnergy_Wh: number;
  averageElectricalPower_W: number;
  averageShaftPower_W: number;
}

export function energyBudget(e: EnergyInput): Budget {
  const available = e.batteryEnergy_Wh * e.usableFraction + e.solarPower_W * e.raceDuration_h;
  const electrical = available / e.raceDuration_h;
  return {
    availableEnergy_Wh: available,
    averageElectricalPower_W: electrical,
    averageShaftPower_W: electrical * e.drivetrainEfficiency,
  };
}

export const energyCautions = [CAUTION_BATTERY, CAUTION_DEFER];

export const energyCalculator: Calculator<EnergyCalcInput, EnergyOutput> = {
  kind: 'energy',
  title: 'Race energy budget',
  summary:
    'Usable battery energy plus solar energy over the race, and the average electrical and shaft power they sustain.',
  // 1.1.0: average C-rate and a chart of average power against race duration.
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<EnergyCalcInput>,
  inputs,
  outputs: [
    {
      name: 'availableEnergy_Wh',
      label: 'Available energy',
      unit: 'Wh',
      digits: 0,
      help: 'battery × usable fraction + solar power × duration',
    },
    { name: 'averageElectricalPower_W', label: 'Average electrical power', unit: 'W', digits: 0 },
    { name: 'averageShaftPower_W', label: 'Average shaft power', unit: 'W', digits: 0 },
    {
      name: 'averageCRate',
      label: 'Average battery C-rate',
      unit: '1/h',
      digits: 2,
      help: 'Average battery power over nominal battery energy: usable fraction ÷ race duration (solar power is not drawn from the battery). Peaks are higher.',
    },
  ],
  sources: [
    {
      citation:
        'Energy balance E = V_nom·C_Ah, usable E·DoD, average power E_usable/t: plain arithmetic, no empirical model.',
      use: 'Energy budget.',
    },
  ],
  cautions: energyCautions,
  compute(input) {
    const b = energyBudget(input);
    const warnings: string[] = [];
    if (input.usableFraction > 0.95)
      warnings.push(
        'Planning to use more than 95 % of the pack leaves no reserve for a headwind, a restart or a cold pack.',
      );
    if (b.availableEnergy_Wh === 0) warnings.push('No energy available: the boat cannot move on this budget.');
    // battery power averaged over the race, over its nominal energy, is the average discharge rate in 1/h
    const cRate = input.batteryEnergy_Wh > 0 ? input.usableFraction / input.raceDuration_h : null;
    if (cRate !== null && cRate > input.maxCRate)
      warnings.push(
        `Using ${(100 * input.usableFraction).toFixed(0)} % of the pack in ${input.raceDuration_h} h is an average discharge of ${cRate.toFixed(1)} C, above the ${input.maxCRate} C limit you gave: the cells will overheat and deliver less than their rated energy. Check the cell datasheet and the battery calculator.`,
      );
    const durations = linspace(Math.min(0.25, input.raceDuration_h), Math.max(2 * input.raceDuration_h, 1), 48);
    const budgets = durations.map((t) => energyBudget({ ...input, raceDuration_h: t }));
    const series: SeriesSet = {
      title: 'Average power the budget sustains against race duration',
      x: { name: 'raceDuration_h', label: 'Race duration', unit: 'h', values: durations },
      y: [
        {
          name: 'averageElectricalPower_W',
          label: 'Average electrical power',
          unit: 'W',
          values: budgets.map((x) => x.averageElectricalPower_W),
        },
        {
          name: 'averageShaftPower_W',
          label: 'Average shaft power',
          unit: 'W',
          values: budgets.map((x) => x.averageShaftPower_W),
        },
      ],
    };
    return { outputs: { ...b, averageCRate: cRate }, series: { duration: series }, warnings };
  },
};
