// Coolant loop for a motor or controller: coolant temperature rise from Q = ṁ·c_p·ΔT, a conservative hot-spot
// temperature (outlet coolant + heat × thermal resistance), and optionally the Darcy–Weisbach pressure drop
// of the hose or pipe run.
import { z } from 'zod';
import { CAUTION_COOLING, CAUTION_DEFER } from './cautions';
import {
  coolantProperties,
  coolantRange,
  GLYCOL_FRACTION_DEFAULT,
  GLYCOL_FRACTION_MAX,
  glycolFractionOf,
  type Coolant,
} from './coolant';
import { OutOfRangeError } from './errors';
import { choice, num, objectSchema } from './fields';
import { darcyWeisbach, frictionFactor, RE_LAMINAR, RE_TURBULENT } from './pipe';
import { SRC_COLEBROOK, SRC_FLUIDS, SRC_IAPWS08_VISC, SRC_IAPWS95, SRC_MELINDER, SRC_SCP } from './sources';
import type { Calculator, InputMeta } from './types';

export interface CoolingInput {
  heatFrom: 'losses' | 'heat';
  heat_W?: number;
  inputPower_W?: number;
  efficiency?: number;
  flow_lpm: number;
  coolant: Coolant;
  glycolFraction?: number;
  inlet_C: number;
  thermalResistance_KperW: number;
  pipeBore_mm?: number;
  pipeLength_m?: number;
  roughness_mm: number;
}

export type CoolingOutput = {
  heat_W: number;
  coolantRise_K: number;
  outlet_C: number;
  hotspot_C: number;
  pressureDrop_Pa: number | null;
  reynolds: number | null;
};

const DEMO_INPUT_POWER_W = 4000;
const DEMO_EFFICIENCY = 0.97;

const HEAT_FROM = 'heatFrom';
const inputs: InputMeta[] = [
  choice({
    name: HEAT_FROM,
    label: 'Heat known as',
    unit: '',
    default: 'losses',
    group: 'Heat',
    options: [
      { value: 'losses', label: 'Input power and efficiency' },
      { value: 'heat', label: 'Heat to remove' },
    ],
    help: 'Give the heat directly, or the power into the cooled unit and its efficiency.',
  }),
  num({
    name: 'heat_W',
    label: 'Heat to remove',
    unit: 'W',
    min: 0,
    max: 100000,
    step: 1,
    default: 150,
    when: { input: HEAT_FROM, is: ['heat'] },
    group: 'Heat',
    help: 'Heat into the coolant (demo default 150 W).',
  }),
  num({
    name: 'inputPower_W',
    label: 'Input power',
    unit: 'W',
    min: 0,
    max: 500000,
    step: 10,
    default: DEMO_INPUT_POWER_W,
    when: { input: HEAT_FROM, is: ['losses'] },
    group: 'Heat',
    help: 'Electrical power into the motor or controller (demo default 4000 W); with its efficiency gives the heat (1 − η)·P.',
  }),
  num({
    name: 'efficiency',
    label: 'Efficiency',
    unit: '',
    min: 0.01,
    max: 1,
    step: 0.005,
    default: DEMO_EFFICIENCY,
    when: { input: HEAT_FROM, is: ['losses'] },
    group: 'Heat',
    help: 'Efficiency of the cooled unit at that power, as a fraction (demo default 0.97).',
  }),
  num({
    name: 'flow_lpm',
    label: 'Coolant flow',
    unit: 'L/min',
    min: 0.01,
    max: 500,
    step: 0.1,
    default: 4,
    group: 'Coolant',
    help: 'Volume flow through the cold plate or jacket.',
  }),
  choice({
    name: 'coolant',
    label: 'Coolant',
    unit: '',
    default: 'water',
    group: 'Coolant',
    options: [
      { value: 'water', label: 'Water' },
      { value: 'glycol', label: 'Ethylene glycol–water (mass fraction below)' },
      { value: 'glycol50', label: 'Ethylene glycol 50 % by volume' },
    ],
    help: 'Water carries more heat; a glycol mix protects against frost when the boat is stored cold. “50 % by volume” is the same mix as a glycol mass fraction of about 0.53.',
  }),
  num({
    name: 'glycolFraction',
    label: 'Glycol mass fraction',
    unit: '',
    min: 0,
    max: GLYCOL_FRACTION_MAX,
    step: 0.01,
    optional: true,
    group: 'Coolant',
    help: `Mass of ethylene glycol over mass of mix, 0–0.6, for the ethylene glycol–water coolant (${GLYCOL_FRACTION_DEFAULT} when empty). Properties from Melinder’s correlation.`,
  }),
  num({
    name: 'inlet_C',
    label: 'Inlet temperature',
    unit: '°C',
    min: -25,
    max: 95,
    step: 0.5,
    default: 25,
    group: 'Coolant',
    help: 'Coolant temperature entering the cooled unit (lake-water loops run near the water temperature).',
  }),
  num({
    name: 'thermalResistance_KperW',
    label: 'Thermal resistance to coolant',
    unit: 'K/W',
    min: 0,
    max: 50,
    step: 0.001,
    default: 0.1,
    group: 'Hot spot',
    help: 'Sum of series resistances from the hot spot (junction or winding) to the coolant, e.g. junction–case + case–plate + plate–coolant, for the heat path considered.',
  }),
  num({
    name: 'pipeBore_mm',
    label: 'Pipe bore',
    unit: 'mm',
    min: 1,
    max: 200,
    step: 0.5,
    optional: true,
    group: 'Pipe (optional)',
    help: 'Inner diameter of the hose or pipe run, for the pressure drop.',
  }),
  num({
    name: 'pipeLength_m',
    label: 'Pipe length',
    unit: 'm',
    min: 0.01,
    max: 200,
    step: 0.05,
    optional: true,
    group: 'Pipe (optional)',
    help: 'Length of the run (straight-pipe loss only; add fittings separately).',
  }),
  num({
    name: 'roughness_mm',
    label: 'Wall roughness ε',
    unit: 'mm',
    min: 0,
    max: 5,
    step: 0.0005,
    default: 0.0015,
    group: 'Pipe (optional)',
    help: 'Absolute roughness: about 0.0015 mm for drawn tubing and smooth hose.',
  }),
];

// Calculations saved before the choice existed (and API callers who leave it out) say which heat they mean by
// what they give: a heat figure means "heat", anything else the input power and efficiency.
const inferHeatFrom = (raw: unknown) => {
  if (raw && typeof raw === 'object' && !Array.isArray(raw)) {
    const r = raw as Record<string, unknown>;
    if (r[HEAT_FROM] == null) return { ...r, [HEAT_FROM]: r.heat_W == null ? 'losses' : 'heat' };
  }
  return raw;
};

const schema = z.preprocess(inferHeatFrom, objectSchema(inputs)).superRefine((v, ctx) => {
  const o = v as Record<string, number | undefined>;
  if ((o.pipeBore_mm === undefined) !== (o.pipeLength_m === undefined)) {
    const missing = o.pipeBore_mm === undefined ? 'pipeBore_mm' : 'pipeLength_m';
    ctx.addIssue({ code: 'custom', path: [missing], message: 'Give both pipe bore and pipe length, or neither.' });
  }
});

/** Series thermal path: T_hot = T_ref + P·ΣR_th (semiconductor datasheet practice). */
export function junctionTemperature(refC: number, power_W: number, resistances_KperW: number[]): number {
  return refC + power_W * resistances_KperW.reduce((a, b) => a + b, 0);
}

export const coolingCalculator: Calculator<CoolingInput, CoolingOutput> = {
  kind: 'cooling',
  title: 'Coolant loop and hot spot',
  summary:
    'Coolant temperature rise for a given heat and flow, a conservative hot-spot temperature through the thermal resistance, and the pressure drop of the pipe run.',
  engineVersion: '1.1.0',
  inputSchema: schema as unknown as z.ZodType<CoolingInput>,
  inputs,
  outputs: [
    { name: 'heat_W', label: 'Heat into coolant', unit: 'W', digits: 0 },
    { name: 'coolantRise_K', label: 'Coolant temperature rise', unit: 'K', digits: 2 },
    { name: 'outlet_C', label: 'Outlet temperature', unit: '°C', digits: 1 },
    {
      name: 'hotspot_C',
      label: 'Hot-spot temperature',
      unit: '°C',
      digits: 1,
      help: 'Outlet coolant + heat × thermal resistance (conservative: uses the warmest coolant).',
    },
    {
      name: 'pressureDrop_Pa',
      label: 'Pipe pressure drop',
      unit: 'Pa',
      digits: 0,
      help: 'Straight pipe only; empty when no pipe is given.',
    },
    { name: 'reynolds', label: 'Pipe Reynolds number', unit: '', digits: 0 },
  ],
  sources: [SRC_IAPWS95, SRC_IAPWS08_VISC, SRC_MELINDER, SRC_SCP, SRC_COLEBROOK, SRC_FLUIDS],
  cautions: [CAUTION_COOLING, CAUTION_DEFER],
  compute(input) {
    const heat =
      input.heatFrom === 'heat'
        ? (input.heat_W as number)
        : (input.inputPower_W as number) * (1 - (input.efficiency as number));
    const fraction = glycolFractionOf(input.coolant, input.glycolFraction);
    const [tMin, tMax] = coolantRange(input.coolant, fraction);
    if (input.inlet_C < tMin)
      throw new OutOfRangeError(
        'inlet_C',
        input.coolant === 'water'
          ? 'Water freezes at this inlet temperature; use a glycol mix.'
          : `This mix freezes at ${tMin.toFixed(1)} °C; raise the glycol fraction or the inlet temperature.`,
      );
    const q = input.flow_lpm / 60000; // m³/s
    let mean = input.inlet_C;
    let rise = 0;
    let props = coolantProperties(input.coolant, mean, input.glycolFraction);
    // Properties at the mean coolant temperature; three passes settle it to well below 0.01 K.
    for (let i = 0; i < 3; i++) {
      rise = heat / (props.density_kgm3 * q * props.cp_JkgK);
      mean = input.inlet_C + rise / 2;
      if (input.inlet_C + rise > tMax) break;
      props = coolantProperties(input.coolant, mean, input.glycolFraction);
    }
    const outlet = input.inlet_C + rise;
    if (outlet > tMax)
      throw new OutOfRangeError(
        'flow_lpm',
        `The coolant would leave at ${outlet.toFixed(0)} °C, ${input.coolant === 'water' ? 'at or above boiling' : 'beyond the range of the property correlation'}; raise the flow or cut the heat.`,
      );
    const hotspot = outlet + heat * input.thermalResistance_KperW;
    const warnings: string[] = [];
    if (input.coolant !== 'water' && fraction < 0.2)
      warnings.push(
        'Below about 20 % glycol by mass a mix gives little frost protection and may not inhibit corrosion; follow the coolant maker’s minimum.',
      );
    if (outlet > 60)
      warnings.push(`Outlet coolant at ${outlet.toFixed(0)} °C can scald; check hose and fitting ratings.`);
    if (hotspot > 125)
      warnings.push(
        `Hot spot ${hotspot.toFixed(0)} °C: check it against the device's maximum junction or winding temperature with margin.`,
      );

    let pressureDrop: number | null = null;
    let reynolds: number | null = null;
    if (input.pipeBore_mm !== undefined && input.pipeLength_m !== undefined) {
      const D = input.pipeBore_mm / 1000;
      const U = q / ((Math.PI * D * D) / 4);
      reynolds = (props.density_kgm3 * U * D) / props.viscosity_Pas;
      const f = frictionFactor(reynolds, input.roughness_mm / input.pipeBore_mm);
      pressureDrop = darcyWeisbach(f, input.pipeLength_m, D, props.density_kgm3, U);
      if (reynolds >= RE_LAMINAR && reynolds < RE_TURBULENT)
        warnings.push(
          `Pipe Re ${reynolds.toFixed(0)} is in the laminar–turbulent transition; the friction factor there is uncertain.`,
        );
    }
    return {
      outputs: {
        heat_W: heat,
        coolantRise_K: rise,
        outlet_C: outlet,
        hotspot_C: hotspot,
        pressureDrop_Pa: pressureDrop,
        reynolds,
      },
      warnings,
    };
  },
};
