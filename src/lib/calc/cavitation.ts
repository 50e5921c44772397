// Cavitation checks for a propeller at one operating point: the cavitation number at 0.7 R, Burrill's thrust
// loading coefficient against the 5 % back-cavitation line of his diagram, and Keller's minimum blade area.
// Both are screening criteria for propellers in open water; heavy wake, shallow immersion and ventilation from
// the surface can make things worse than they say.
import { num } from './fields';
import { vapourPressure } from './properties/vapour';
import type { WaterKind } from './properties/water';
import { SRC_BURRILL, SRC_IF97_PSAT, SRC_KELLER, SRC_SHARQAWY_PV } from './sources';
import type { InputMeta, OutputMeta } from './types';

export const P_ATM = 101325; // Pa
const G = 9.80665; // m/s², standard gravity

export interface CavitationInput {
  shaftDepth_m: number;
  kellerK: number;
}

export const cavitationInputs = (group = 'Cavitation'): InputMeta[] => [
  num({
    name: 'shaftDepth_m',
    label: 'Shaft immersion h',
    unit: 'm',
    min: 0,
    max: 10,
    step: 0.01,
    default: 0.3,
    group,
    help: 'Depth of the propeller shaft below the water surface at speed (demo default 0.30 m). Shallow propellers also draw air (ventilation), which these checks do not cover.',
  }),
  num({
    name: 'kellerK',
    label: 'Keller constant k',
    unit: '',
    min: 0,
    max: 0.5,
    step: 0.01,
    default: 0.2,
    group,
    help: 'Allowance in Keller’s blade-area criterion: 0.2 for single-screw ships, 0.1 for twin-screw, 0–0.1 for fast twin-screw craft, as the criterion’s source gives it.',
  }),
];

export const BURRILL_LINE = '5 % back cavitation';
/** Range of σ₀.₇R over which the fit of the 5 % line was made. */
export const BURRILL_SIGMA_RANGE: readonly [number, number] = [0.16, 1.5];

/**
 * Thrust loading coefficient allowed by the 5 % back-cavitation line of Burrill's diagram at σ₀.₇R (log fit, see
 * SRC_BURRILL). Above the fit's range the value at σ = 1.5 is held (conservative); below it the fit is used as is,
 * and it falls to zero near σ = 0.084 (every propeller then fails).
 */
export function burrillLimit(sigma: number): number {
  const s = Math.min(sigma, BURRILL_SIGMA_RANGE[1]);
  if (!(s > 0)) return 0;
  return Math.max(0, 0.1082 * Math.log(s) + 0.2675);
}

/** Projected over developed blade area, A_P/A_D = 1.067 − 0.229·P/D (Burrill). */
export function projectedAreaRatio(pitchRatio: number): number {
  return 1.067 - 0.229 * pitchRatio;
}

export interface CavitationCheck {
  cavitationNumber: number;
  thrustLoadingCoefficient: number;
  burrillLimit: number;
  kellerMinBladeAreaRatio: number;
  burrillOk: boolean;
  kellerOk: boolean;
}

export interface CavitationEnv {
  rho: number;
  /** p_atm + ρgh − p_v, Pa */
  staticHead: number;
  kellerK: number;
}

export function cavitationEnv(
  input: CavitationInput & { temperature_C: number; water: WaterKind },
  rho: number,
): CavitationEnv {
  return {
    rho,
    staticHead: P_ATM + rho * G * input.shaftDepth_m - vapourPressure(input.temperature_C, input.water),
    kellerK: input.kellerK,
  };
}

/** The checks for a B-series propeller (Z, A_E/A_0, P/D) of diameter D at n (rev/s), V_A (m/s), thrust T (N). */
export function cavitationCheck(
  p: { blades: number; bladeAreaRatio: number; pitchRatio: number },
  D: number,
  n: number,
  vA: number,
  thrust: number,
  env: CavitationEnv,
): CavitationCheck {
  const vR2 = vA * vA + (0.7 * Math.PI * n * D) ** 2;
  const q = 0.5 * env.rho * vR2;
  const sigma = env.staticHead / q;
  const aP = ((p.bladeAreaRatio * Math.PI * D * D) / 4) * projectedAreaRatio(p.pitchRatio);
  const T = Math.max(thrust, 0);
  const tau = T / (aP * q);
  const limit = burrillLimit(sigma);
  const keller = ((1.3 + 0.3 * p.blades) * T) / (env.staticHead * D * D) + env.kellerK;
  return {
    cavitationNumber: sigma,
    thrustLoadingCoefficient: tau,
    burrillLimit: limit,
    kellerMinBladeAreaRatio: keller,
    burrillOk: tau <= limit,
    kellerOk: p.bladeAreaRatio >= keller,
  };
}

/** Warnings for a failed check (empty when both pass). `where` says at which point, e.g. "at the race point". */
export function cavitationWarnings(c: CavitationCheck, bladeAreaRatio: number, where: string): string[] {
  const out: string[] = [];
  if (!c.burrillOk)
    out.push(
      `Cavitation ${where}: Burrill’s thrust loading τ_c = ${c.thrustLoadingCoefficient.toFixed(3)} is above the ${BURRILL_LINE} line (${c.burrillLimit.toFixed(3)} at σ₀.₇R = ${c.cavitationNumber.toFixed(2)}). Expect thrust breakdown and blade erosion: more blade area, a larger diameter at lower rpm, or deeper immersion.`,
    );
  if (!c.kellerOk)
    out.push(
      `Cavitation ${where}: Keller’s criterion asks for a blade area ratio of at least ${c.kellerMinBladeAreaRatio.toFixed(2)}; this propeller has ${bladeAreaRatio}.`,
    );
  if (c.cavitationNumber < BURRILL_SIGMA_RANGE[0])
    out.push(
      `σ₀.₇R = ${c.cavitationNumber.toFixed(3)} is below the range of Burrill’s diagram (${BURRILL_SIGMA_RANGE[0]}–${BURRILL_SIGMA_RANGE[1]}): the propeller is deep in cavitation; the open-water figures do not hold.`,
    );
  return out;
}

export const cavitationOutputs = (where: string): OutputMeta[] => [
  {
    name: 'cavitationNumber',
    label: 'Cavitation number σ₀.₇R',
    unit: '',
    digits: 3,
    help: `(p_atm + ρgh − p_v)/(½ρ(V_A² + (0.7πnD)²)) ${where}; p_atm 101,325 Pa, p_v from the water temperature.`,
  },
  {
    name: 'thrustLoadingCoefficient',
    label: 'Thrust loading τ_c (Burrill)',
    unit: '',
    digits: 3,
    help: `T/(A_P·½ρV_R²), A_P = A_D(1.067 − 0.229·P/D), ${where}.`,
  },
  {
    name: 'burrillLimit',
    label: `Burrill limit τ_c (${BURRILL_LINE})`,
    unit: '',
    digits: 3,
    help: 'Highest τ_c on Burrill’s 5 % back-cavitation line at this σ₀.₇R (fit of the diagram, see sources).',
  },
  {
    name: 'burrillLine',
    label: 'Burrill line used',
    unit: '',
    digits: 0,
    help: 'The line of Burrill’s diagram the limit is read from.',
  },
  {
    name: 'kellerMinBladeAreaRatio',
    label: 'Keller minimum A_E/A_0',
    unit: '',
    digits: 3,
    help: `(1.3 + 0.3·Z)·T/((p_atm + ρgh − p_v)·D²) + k, ${where}.`,
  },
];

export const cavitationSources = [SRC_BURRILL, SRC_KELLER, SRC_IF97_PSAT, SRC_SHARQAWY_PV];

export function cavitationOutputValues(c: CavitationCheck) {
  return {
    cavitationNumber: c.cavitationNumber,
    thrustLoadingCoefficient: c.thrustLoadingCoefficient,
    burrillLimit: c.burrillLimit,
    burrillLine: BURRILL_LINE,
    kellerMinBladeAreaRatio: c.kellerMinBladeAreaRatio,
  };
}
