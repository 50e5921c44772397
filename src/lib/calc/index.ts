import { batteryCalculator } from './battery';
import { cableCalculator } from './cable';
import { coolingCalculator } from './cooling';
import { energyCalculator } from './energy';
import { foilCalculator } from './foil';
import { OutOfRangeError } from './errors';
import { planingCalculator } from './planing';
import { propellerCalculator } from './propeller';
import { raceCalculator } from './race';
import { resistanceCalculator } from './resistance';
import { solarCalculator } from './solar';
import { sprintCalculator } from './sprint';
import { sweepCalculator } from './sweep';
import type { CalcResult, Calculator } from './types';
import { waterCalculator } from './water';

export type * from './types';

export const calculators = Object.freeze({
  water: waterCalculator,
  propeller: propellerCalculator,
  resistance: resistanceCalculator,
  solar: solarCalculator,
  energy: energyCalculator,
  cooling: coolingCalculator,
  cable: cableCalculator,
  race: raceCalculator,
  'propeller-sweep': sweepCalculator,
  // issue 15 (motor envelope, sprint, battery)
  sprint: sprintCalculator,
  battery: batteryCalculator,
  // issue 15 sections 3–4 (planing, foils)
  planing: planingCalculator,
  foil: foilCalculator,
} as const);

export type CalculatorKind = keyof typeof calculators;

export const calculatorKinds = Object.freeze(Object.keys(calculators) as CalculatorKind[]);

/**
 * Any calculator of the registry, seen from outside: its inputs are whatever its own schema parses (so they are
 * `unknown` until `inputSchema` has parsed them) and its outputs are plain numbers and labels.
 */
type AnyCalculator = Calculator<unknown, Record<string, number | string | null>>;

export function getCalculator(kind: string): AnyCalculator | undefined {
  return Object.prototype.hasOwnProperty.call(calculators, kind)
    ? (calculators as Record<string, AnyCalculator>)[kind]
    : undefined;
}

export type RunResult =
  | {
      ok: true;
      inputs: Record<string, unknown>;
      result: CalcResult<Record<string, number | string | null>>;
      engineVersion: string;
    }
  | { ok: false; error: 'invalid_input'; issues: { path: string; message: string }[] }
  | { ok: false; error: 'out_of_range'; input: string; message: string };

/**
 * Parse and compute in one step, for the API routes and the islands alike. An unknown kind is reported as
 * invalid input on the path `kind` (routes that know the kind is missing should answer 404 first).
 */
export function runCalculator(kind: string, rawInputs: unknown): RunResult {
  const calc = getCalculator(kind);
  if (!calc)
    return {
      ok: false,
      error: 'invalid_input',
      issues: [{ path: 'kind', message: `Unknown calculator kind "${kind}".` }],
    };
  const parsed = calc.inputSchema.safeParse(rawInputs ?? {});
  if (!parsed.success) {
    return {
      ok: false,
      error: 'invalid_input',
      issues: parsed.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message })),
    };
  }
  try {
    const result = calc.compute(parsed.data);
    return { ok: true, inputs: parsed.data as Record<string, unknown>, result, engineVersion: calc.engineVersion };
  } catch (e) {
    if (e instanceof OutOfRangeError) return { ok: false, error: 'out_of_range', input: e.input, message: e.message };
    throw e;
  }
}
