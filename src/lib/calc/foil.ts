// A fully submerged hydrofoil by finite-wing theory: Helmbold's lift-curve slope, lifting-line induced drag,
// a constant section drag, the speed at which it carries the boat, and a cavitation check of its suction peak.
// Free-surface, strut, ventilation, stall and Reynolds-number effects are left out and said so on screen.
import { z } from 'zod';
import { CAUTION_DEFER, CAUTION_FOIL, CAUTION_PROPELLER, CAUTION_WATER } from './cautions';
import { num, objectSchema } from './fields';
import { linspace } from './numeric';
import { vapourPressure } from './properties/vapour';
import { P0, waterProperties, type WaterKind } from './properties/water';
import { SRC_CAVITATION_INCEPTION, SRC_HELMBOLD, SRC_IF97_SAT, SRC_ITTC_WATER, SRC_PRANDTL_INDUCED } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';
import { temperatureInput, waterInput } from './water';

const G = 9.80665;
const DEG = Math.PI / 180;

export interface FoilInput {
  area_m2: number;
  aspectRatio: number;
  angleOfAttack_deg: number;
  zeroLiftAngle_deg: number;
  sectionDragCoefficient: number;
  spanEfficiency: number;
  speed_mps: number;
  mass_kg: number;
  depth_m: number;
  peakSuction: number;
  temperature_C: number;
  water: WaterKind;
}

export type FoilOutput = {
  liftSlope_perRad: number;
  liftCoefficient: number;
  lift_N: number;
  inducedDrag_N: number;
  drag_N: number;
  liftToDrag: number | null;
  takeOffSpeed_mps: number | null;
  cavitationNumber: number;
  cavitationSpeed_mps: number;
};

const inputs: InputMeta[] = [
  num({
    name: 'area_m2',
    label: 'Foil area S',
    unit: 'm²',
    min: 0.001,
    max: 10,
    step: 0.001,
    default: 0.2,
    group: 'Foil',
    help: 'Planform area of the lifting foil (demo default 0.2 m²).',
  }),
  num({
    name: 'aspectRatio',
    label: 'Aspect ratio A',
    unit: '',
    min: 0.5,
    max: 40,
    step: 0.1,
    default: 8,
    group: 'Foil',
    help: 'Span² / area (demo default 8).',
  }),
  num({
    name: 'angleOfAttack_deg',
    label: 'Angle of attack α',
    unit: '°',
    min: -10,
    max: 20,
    step: 0.1,
    default: 3,
    group: 'Foil',
    help: 'Geometric angle between the chord line and the flow.',
  }),
  num({
    name: 'zeroLiftAngle_deg',
    label: 'Zero-lift angle α₀',
    unit: '°',
    min: -10,
    max: 5,
    step: 0.1,
    default: -2,
    group: 'Foil',
    help: 'Angle at which the section gives no lift (about −2° for a cambered section; 0 for a symmetric one).',
  }),
  num({
    name: 'sectionDragCoefficient',
    label: 'Section drag coefficient c_d',
    unit: '',
    min: 0,
    max: 0.1,
    step: 0.0005,
    default: 0.008,
    group: 'Foil',
    help: 'Profile drag of the section, taken as constant (demo default 0.008).',
  }),
  num({
    name: 'spanEfficiency',
    label: 'Span efficiency e',
    unit: '',
    min: 0.3,
    max: 1,
    step: 0.01,
    default: 0.9,
    group: 'Foil',
    help: '1 for an elliptic lift distribution; 0.8–0.95 for usual planforms.',
  }),
  num({
    name: 'depth_m',
    label: 'Submergence h',
    unit: 'm',
    min: 0,
    max: 10,
    step: 0.01,
    default: 0.4,
    group: 'Foil',
    help: 'Depth of the foil below the surface, for the cavitation number.',
  }),
  num({
    name: 'peakSuction',
    label: 'Peak suction −C_p,min',
    unit: '',
    min: 0.05,
    max: 10,
    step: 0.05,
    default: 0.8,
    group: 'Foil',
    help: 'Largest suction on the section at this angle, as −C_p,min, from the section’s pressure distribution (e.g. a panel code). Demo default 0.8.',
  }),
  num({
    name: 'speed_mps',
    label: 'Boat speed V',
    unit: 'm/s',
    min: 0.1,
    max: 40,
    step: 0.1,
    default: 7,
    group: 'Load',
    help: 'Speed of the foil through the water (demo default 7 m/s).',
  }),
  num({
    name: 'mass_kg',
    label: 'Supported mass',
    unit: 'kg',
    min: 0,
    max: 100000,
    step: 1,
    default: 200,
    group: 'Load',
    help: 'Mass this foil must carry when the hull is clear of the water (demo default 200 kg).',
  }),
  temperatureInput('Water'),
  waterInput('Water'),
];

/** Helmbold (1942): lift-curve slope of a finite wing, per radian. */
export function helmboldSlope(A: number): number {
  return (2 * Math.PI * A) / (2 + Math.sqrt(A * A + 4));
}

/** Lifting-line induced-drag coefficient C_L²/(π e A). */
export function inducedDragCoefficient(cl: number, A: number, e: number): number {
  return (cl * cl) / (Math.PI * e * A);
}

/** Cavitation number at depth h: (p_atm + ρgh − p_v)/(½ρV²). */
export function cavitationNumber(rho: number, depth: number, pv: number, V: number): number {
  return (P0 + rho * G * depth - pv) / (0.5 * rho * V * V);
}

export const foilCalculator: Calculator<FoilInput, FoilOutput> = {
  kind: 'foil',
  title: 'Hydrofoil lift and drag',
  summary:
    'Lift, induced and total drag of a fully submerged foil from Helmbold’s lift slope and lifting-line theory, the speed at which it carries the boat, a cavitation check of its suction peak, and curves against speed.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<FoilInput>,
  inputs,
  outputs: [
    { name: 'liftSlope_perRad', label: 'Lift slope a', unit: '1/rad', digits: 3, help: '2πA/(2 + √(A² + 4))' },
    { name: 'liftCoefficient', label: 'Lift coefficient C_L', unit: '', digits: 4, help: 'a·(α − α₀)' },
    { name: 'lift_N', label: 'Lift', unit: 'N', digits: 1 },
    { name: 'inducedDrag_N', label: 'Induced drag', unit: 'N', digits: 2, help: '½ρV²S·C_L²/(π e A)' },
    { name: 'drag_N', label: 'Total foil drag', unit: 'N', digits: 2, help: 'Section drag + induced drag' },
    { name: 'liftToDrag', label: 'Lift / drag', unit: '', digits: 1 },
    {
      name: 'takeOffSpeed_mps',
      label: 'Take-off speed',
      unit: 'm/s',
      digits: 2,
      help: 'Speed at which lift equals the supported weight at this angle; empty when the foil gives no lift.',
    },
    {
      name: 'cavitationNumber',
      label: 'Cavitation number σ',
      unit: '',
      digits: 3,
      help: '(p_atm + ρgh − p_v)/(½ρV²)',
    },
    {
      name: 'cavitationSpeed_mps',
      label: 'Cavitation inception speed',
      unit: 'm/s',
      digits: 2,
      help: 'Speed at which σ falls to the peak suction −C_p,min.',
    },
  ],
  sources: [SRC_HELMBOLD, SRC_PRANDTL_INDUCED, SRC_CAVITATION_INCEPTION, SRC_IF97_SAT, SRC_ITTC_WATER],
  cautions: [CAUTION_FOIL, CAUTION_WATER, CAUTION_PROPELLER, CAUTION_DEFER],
  compute(input) {
    const w = waterProperties(input.temperature_C, input.water);
    const rho = w.density_kgm3;
    const A = input.aspectRatio;
    const a = helmboldSlope(A);
    const cl = a * (input.angleOfAttack_deg - input.zeroLiftAngle_deg) * DEG;
    const cd = input.sectionDragCoefficient + inducedDragCoefficient(cl, A, input.spanEfficiency);
    const S = input.area_m2;
    const forces = (V: number) => {
      const q = 0.5 * rho * V * V;
      return {
        lift: q * S * cl,
        induced: q * S * inducedDragCoefficient(cl, A, input.spanEfficiency),
        drag: q * S * cd,
      };
    };
    const V = input.speed_mps;
    const f = forces(V);
    const weight = input.mass_kg * G;
    const takeOff = cl > 0 && weight > 0 ? Math.sqrt((2 * weight) / (rho * S * cl)) : null;
    const pv = vapourPressure(input.temperature_C, input.water);
    const sigma = cavitationNumber(rho, input.depth_m, pv, V);
    const vCav = Math.sqrt((2 * (P0 + rho * G * input.depth_m - pv)) / (rho * input.peakSuction));

    const warnings: string[] = [];
    if (cl <= 0) warnings.push('At this angle the foil gives no lift (α ≤ α₀).');
    else if (f.lift < weight)
      warnings.push(
        `Lift ${f.lift.toFixed(0)} N is below the supported weight ${weight.toFixed(0)} N: the boat does not fly on this foil at ${V} m/s.`,
      );
    if (input.angleOfAttack_deg - input.zeroLiftAngle_deg > 12)
      warnings.push(
        'More than 12° above zero lift most sections are near stall; the linear lift slope then overestimates lift (common practice).',
      );
    if (sigma < input.peakSuction)
      warnings.push(
        `Cavitation number ${sigma.toFixed(2)} is below the peak suction ${input.peakSuction}: the suction side cavitates at ${V} m/s (above ${vCav.toFixed(1)} m/s at this depth). Expect lift loss, noise and erosion.`,
      );
    const chord = Math.sqrt(S / A);
    if (input.depth_m < chord)
      warnings.push(
        `Submergence ${input.depth_m} m is less than one mean chord (${chord.toFixed(2)} m): near the surface a foil loses lift and may ventilate, which this deep-water model leaves out.`,
      );
    warnings.push(
      'Deep, fully wetted foil: free-surface and strut effects, ventilation, stall, tip shape and Reynolds-number effects on the section drag are not included.',
    );

    const vMax = Math.max(1.5 * V, takeOff ? 1.3 * takeOff : 0);
    const speeds = linspace(0.1 * vMax, vMax, 31);
    const pts = speeds.map(forces);
    const series: SeriesSet = {
      title: 'Lift, drag and weight against speed',
      x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: speeds },
      y: [
        { name: 'lift_N', label: 'Lift', unit: 'N', values: pts.map((p) => p.lift) },
        { name: 'weight_N', label: 'Supported weight', unit: 'N', values: speeds.map(() => weight) },
        { name: 'drag_N', label: 'Foil drag', unit: 'N', values: pts.map((p) => p.drag) },
      ],
    };
    return {
      outputs: {
        liftSlope_perRad: a,
        liftCoefficient: cl,
        lift_N: f.lift,
        inducedDrag_N: f.induced,
        drag_N: f.drag,
        liftToDrag: f.drag > 0 ? f.lift / f.drag : null,
        takeOffSpeed_mps: takeOff,
        cavitationNumber: sigma,
        cavitationSpeed_mps: vCav,
      },
      series: { forces: series },
      warnings,
    };
  },
};
