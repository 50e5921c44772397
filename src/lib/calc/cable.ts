// DC cable resistance, voltage drop and loss for annealed copper: the maximum conductor resistance of IEC 60228
// per nominal section (stranded class 2 by default, solid class 1), corrected to the conductor temperature.
import { z } from 'zod';
import { CAUTION_BATTERY, CAUTION_CABLE, CAUTION_DEFER } from './cautions';
import { IEC60228_CLASS1, IEC60228_CLASS2 } from './data/iec60228';
import { choice, num, objectSchema } from './fields';
import { interp } from './numeric';
import { SRC_COPPER, SRC_FLOYD, SRC_IEC60228 } from './sources';
import type { Calculator, InputMeta } from './types';

export interface CableInput {
  current_A: number;
  length_m: number;
  crossSection_mm2: number;
  temperature_C: number;
  systemVoltage_V: number;
  conductor: Conductor;
}

export type Conductor = 'stranded' | 'solid';

export type CableOutput = {
  resistance_ohm: number;
  voltageDrop_V: number;
  voltageDropPercent: number;
  powerLoss_W: number;
  conductorResistance20_ohmPerKm: number;
};

/** IEC 60028 annealed copper: 1/58 Ω·mm²/m at 20 °C. */
export const RHO20_CU = 1.7241e-8; // Ω·m
export const ALPHA20_CU = 0.00393; // 1/K

const inputs: InputMeta[] = [
  num({
    name: 'current_A',
    label: 'Current',
    unit: 'A',
    min: 0,
    max: 2000,
    step: 1,
    default: 100,
    help: 'Continuous current in the run (demo default 100 A).',
  }),
  num({
    name: 'length_m',
    label: 'Run length (one way)',
    unit: 'm',
    min: 0.01,
    max: 500,
    step: 0.05,
    default: 2,
    help: 'One-way length; the loop (out and back) is twice this.',
  }),
  num({
    name: 'crossSection_mm2',
    label: 'Conductor cross-section',
    unit: 'mm²',
    min: 0.05,
    max: 1000,
    step: 0.5,
    default: 16,
    help: 'Copper cross-section of one conductor.',
  }),
  num({
    name: 'temperature_C',
    label: 'Conductor temperature',
    unit: '°C',
    min: -40,
    max: 200,
    step: 1,
    default: 20,
    help: 'Conductor temperature; under load it runs above ambient.',
  }),
  num({
    name: 'systemVoltage_V',
    label: 'System voltage',
    unit: 'V',
    min: 1,
    max: 1500,
    step: 1,
    default: 48,
    help: 'Nominal DC voltage, for the drop in percent.',
  }),
  choice({
    name: 'conductor',
    label: 'Conductor',
    unit: '',
    default: 'stranded',
    options: [
      { value: 'stranded', label: 'Stranded (IEC 60228 class 2)' },
      { value: 'solid', label: 'Solid (IEC 60228 class 1)' },
    ],
    help: 'Stranded conductors have more resistance than the bare cross-section suggests; the standard’s maximum resistance per nominal section is used.',
  }),
];

const TABLES: Record<Conductor, { rows: readonly (readonly [number, number])[]; name: string }> = {
  stranded: { rows: IEC60228_CLASS2, name: 'IEC 60228 Table 2 (class 2, stranded)' },
  solid: { rows: IEC60228_CLASS1, name: 'IEC 60228 Table 1 (class 1, solid)' },
};

/** Resistance of a copper conductor, Ω. */
export function copperResistance(length_m: number, area_mm2: number, tempC: number): number {
  return ((RHO20_CU * length_m) / (area_mm2 * 1e-6)) * (1 + ALPHA20_CU * (tempC - 20));
}

/**
 * Maximum resistance at 20 °C, Ω/km, of a copper conductor of this class and section: the standard's value at a
 * nominal section; between nominal sections the ratio of the table value to ρ₂₀/A is interpolated in ln A, and
 * beyond the table the ratio at its end is kept. `nominal` tells whether the section is one of the table's.
 */
export function iec60228Resistance(area_mm2: number, conductor: Conductor): { ohmPerKm: number; nominal: boolean } {
  const rows = TABLES[conductor].rows;
  const ideal = (a: number) => copperResistance(1000, a, 20);
  const hit = rows.find(([a]) => Math.abs(a - area_mm2) <= 1e-9 * a);
  if (hit) return { ohmPerKm: hit[1], nominal: true };
  // interp holds the end ratios beyond the table
  const factor = interp(
    Math.log(area_mm2),
    rows.map(([a]) => Math.log(a)),
    rows.map(([a, r]) => r / ideal(a)),
  );
  return { ohmPerKm: ideal(area_mm2) * factor, nominal: false };
}

export const cableCalculator: Calculator<CableInput, CableOutput> = {
  kind: 'cable',
  title: 'Cable voltage drop',
  summary:
    'Loop resistance, voltage drop and loss of a two-wire copper DC run by length, cross-section, conductor class (IEC 60228) and conductor temperature.',
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<CableInput>,
  inputs,
  outputs: [
    { name: 'resistance_ohm', label: 'Loop resistance', unit: 'Ω', digits: 5 },
    { name: 'voltageDrop_V', label: 'Voltage drop', unit: 'V', digits: 3 },
    { name: 'voltageDropPercent', label: 'Voltage drop', unit: '%', digits: 2 },
    { name: 'powerLoss_W', label: 'Power loss', unit: 'W', digits: 1 },
    {
      name: 'conductorResistance20_ohmPerKm',
      label: 'Conductor resistance at 20 °C',
      unit: 'Ω/km',
      digits: 4,
      help: 'Maximum resistance per km of one conductor by IEC 60228 (Table 2 stranded, Table 1 solid).',
    },
  ],
  sources: [SRC_IEC60228, SRC_COPPER, SRC_FLOYD],
  cautions: [CAUTION_BATTERY, CAUTION_CABLE, CAUTION_DEFER],
  compute(input) {
    const r20 = iec60228Resistance(input.crossSection_mm2, input.conductor);
    const R = ((r20.ohmPerKm * 2 * input.length_m) / 1000) * (1 + ALPHA20_CU * (input.temperature_C - 20));
    const dV = input.current_A * R;
    const pct = (100 * dV) / input.systemVoltage_V;
    const warnings: string[] = [];
    if (!r20.nominal)
      warnings.push(
        `${input.crossSection_mm2} mm² is not a nominal section of ${TABLES[input.conductor].name}: the resistance is interpolated between the neighbouring sizes; use the next nominal size the cable is sold in.`,
      );
    if (pct > 3)
      warnings.push(
        `Voltage drop ${pct.toFixed(1)} % is above the 3 % often used as a limit for DC feeders (common practice).`,
      );
    if (input.conductor === 'solid' && input.crossSection_mm2 >= 25)
      warnings.push(
        'IEC 60228 Table 1 lists solid copper of 25 mm² and above for particular cable types only (e.g. mineral insulated): a flexible or stranded cable is the usual choice at this size.',
      );
    const density = input.current_A / input.crossSection_mm2;
    if (density > 5)
      warnings.push(
        `Current density ${density.toFixed(1)} A/mm² is above the ~5 A/mm² often used for continuous duty in free air (common practice): check the cable's ampacity for its insulation, bundling and ambient temperature.`,
      );
    return {
      outputs: {
        resistance_ohm: R,
        voltageDrop_V: dV,
        voltageDropPercent: pct,
        powerLoss_W: input.current_A * dV,
        conductorResistance20_ohmPerKm: r20.ohmPerKm,
      },
      warnings,
    };
  },
};
