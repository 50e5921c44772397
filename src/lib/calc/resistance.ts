// Hull resistance from the ITTC-1957 friction line with a form factor and appendage drag area.
// Wave-making and foil lift are not modelled: at displacement speeds of a light, slender solar boat the
// friction term dominates; above Fn 0.4 a warning says so and points to the planing calculator.
import { z } from 'zod';
import { OutOfRangeError } from './errors';
import { num, objectSchema } from './fields';
import { linspace, timesTenTo } from './numeric';
import { waterProperties, type WaterKind } from './properties/water';
import { SRC_ITTC57, SRC_ITTC78, SRC_ITTC_WATER } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';
import { temperatureInput, waterInput } from './water';

export interface HullInput {
  length_m: number;
  wettedArea_m2: number;
  formFactor: number;
  appendageDragArea_m2: number;
  temperature_C: number;
  water: WaterKind;
}

export interface ResistanceInput extends HullInput {
  speed_mps: number;
}

export type ResistanceOutput = {
  reynolds: number;
  cf: number;
  frictionalResistance_N: number;
  appendageResistance_N: number;
  totalResistance_N: number;
  effectivePower_W: number;
  froude: number;
};

export const hullInputs = (group = 'Hull'): InputMeta[] => [
  num({
    name: 'length_m',
    label: 'Waterline length L',
    unit: 'm',
    min: 0.3,
    max: 50,
    step: 0.05,
    default: 5.5,
    group,
    help: 'Length on the waterline at racing trim (demo default 5.5 m).',
  }),
  num({
    name: 'wettedArea_m2',
    label: 'Wetted surface S',
    unit: 'm²',
    min: 0.05,
    max: 200,
    step: 0.05,
    default: 3,
    group,
    help: 'Wetted surface of the hull at racing trim (demo default 3 m²).',
  }),
  num({
    name: 'formFactor',
    label: 'Form factor 1+k',
    unit: '',
    min: 1,
    max: 2,
    step: 0.01,
    default: 1,
    group,
    help: 'Viscous resistance over flat-plate friction (ITTC-1978). 1.0 for a flat plate; slender hulls are often 1.05–1.2 — from a tank test or a Prohaska plot if you have one.',
  }),
  num({
    name: 'appendageDragArea_m2',
    label: 'Appendage drag area C_D·A',
    unit: 'm²',
    min: 0,
    max: 1,
    step: 0.0005,
    default: 0,
    group,
    help: 'Sum of drag coefficient × reference area for pod, strut, rudder and fins, added as ½ρV²·C_D·A.',
  }),
  temperatureInput('Water'),
  waterInput('Water'),
];

const inputs: InputMeta[] = [
  ...hullInputs(),
  num({
    name: 'speed_mps',
    label: 'Boat speed V',
    unit: 'm/s',
    min: 0.01,
    max: 30,
    step: 0.1,
    default: 5,
    group: 'Speed',
    help: 'Boat speed through the water (demo default 5 m/s).',
  }),
];

/** ITTC-1957: C_F = 0.075/(log₁₀Re − 2)². */
export function ittc57(re: number): number {
  const d = Math.log10(re) - 2;
  return 0.075 / (d * d);
}

/** Standard gravity, m/s². */
const G = 9.80665;
/** Above this Froude number friction-only resistance misses the wave-making part (Froude; common practice). */
export const FROUDE_FRICTION_LIMIT = 0.4;

/** The line was drawn for turbulent flow from model to ship scale; below this it is meaningless. */
export const RE_MIN = 1e5;

export interface HullResistance {
  reynolds: number;
  cf: number;
  frictional_N: number;
  appendage_N: number;
  total_N: number;
}

export function hullResistance(h: HullInput, V: number, rho: number, nu: number): HullResistance {
  if (V <= 0) return { reynolds: 0, cf: 0, frictional_N: 0, appendage_N: 0, total_N: 0 };
  const re = (V * h.length_m) / nu;
  const q = 0.5 * rho * V * V;
  // Below Re ≈ 1e3 the formula diverges; hold C_F there so solvers that probe tiny speeds stay finite.
  const cf = ittc57(Math.max(re, 1e3));
  const frictional = q * h.wettedArea_m2 * cf;
  const appendage = q * h.appendageDragArea_m2;
  return {
    reynolds: re,
    cf,
    frictional_N: frictional,
    appendage_N: appendage,
    total_N: h.formFactor * frictional + appendage,
  };
}

export const resistanceSources = [SRC_ITTC57, SRC_ITTC78, SRC_ITTC_WATER];

export const resistanceCalculator: Calculator<ResistanceInput, ResistanceOutput> = {
  kind: 'resistance',
  title: 'Hull resistance',
  summary:
    'Frictional resistance from the ITTC-1957 line, scaled by a form factor, plus appendage drag; effective power and a resistance curve against speed. Wave-making resistance is not included.',
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<ResistanceInput>,
  inputs,
  outputs: [
    { name: 'reynolds', label: 'Reynolds number Re', unit: '', digits: 0 },
    { name: 'cf', label: 'Friction coefficient C_F', unit: '', digits: 6 },
    { name: 'frictionalResistance_N', label: 'Frictional resistance R_F', unit: 'N', digits: 1 },
    { name: 'appendageResistance_N', label: 'Appendage resistance', unit: 'N', digits: 1 },
    { name: 'totalResistance_N', label: 'Total resistance R_T', unit: 'N', digits: 1, help: '(1+k)·R_F + ½ρV²·C_D·A' },
    { name: 'effectivePower_W', label: 'Effective power P_E', unit: 'W', digits: 0, help: 'P_E = R_T·V' },
    {
      name: 'froude',
      label: 'Froude number Fn',
      unit: '',
      digits: 3,
      help: 'V/√(g·L). Above about 0.4 wave-making resistance, which this calculator leaves out, becomes large.',
    },
  ],
  sources: resistanceSources,
  cautions: [],
  compute(input) {
    const w = waterProperties(input.temperature_C, input.water);
    const V = input.speed_mps;
    const r = hullResistance(input, V, w.density_kgm3, w.kinematicViscosity_m2s);
    if (r.reynolds < RE_MIN)
      throw new OutOfRangeError(
        'speed_mps',
        `Reynolds number ${timesTenTo(r.reynolds, 2)} is below 1·10⁵, where the ITTC-1957 line does not apply; raise the speed or check the length.`,
      );
    const warnings: string[] = [];
    if (r.reynolds < 1e6)
      warnings.push(
        'Re is below 1·10⁶: the boundary layer may be partly laminar, and the turbulent ITTC-1957 line then overestimates friction.',
      );
    if (input.formFactor === 1)
      warnings.push('Form factor 1+k = 1 treats the hull as a flat plate; real hulls have more viscous resistance.');
    const froude = V / Math.sqrt(G * input.length_m);
    if (froude > FROUDE_FRICTION_LIMIT)
      warnings.push(
        `Froude number ${froude.toFixed(2)} is above 0.4: wave-making resistance, not included here, is large at this speed-length ratio, and a planing hull is supported by dynamic lift. Use the planing hull calculator (Savitsky) for a planing hull.`,
      );
    const vMin = (RE_MIN * w.kinematicViscosity_m2s) / input.length_m;
    const speeds = linspace(Math.max(vMin, 0.1 * V), 1.5 * V, 31);
    const pts = speeds.map((v) => hullResistance(input, v, w.density_kgm3, w.kinematicViscosity_m2s).total_N);
    const series: SeriesSet = {
      title: 'Resistance and effective power against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [
        { name: 'totalResistance_N', label: 'Total resistance', unit: 'N', values: pts },
        { name: 'effectivePower_W', label: 'Effective power', unit: 'W', values: pts.map((R, i) => R * speeds[i]) },
      ],
    };
    return {
      outputs: {
        reynolds: r.reynolds,
        cf: r.cf,
        frictionalResistance_N: r.frictional_N,
        appendageResistance_N: r.appendage_N,
        totalResistance_N: r.total_N,
        effectivePower_W: r.total_N * V,
        froude,
      },
      series: { resistance: series },
      warnings,
    };
  },
};
