// DC cable resistance, voltage drop and loss for annealed copper (IEC 60028).
import { z } from 'zod';
import { CAUTION_BATTERY, CAUTION_CABLE, CAUTION_DEFER } from './cautions';
import { num, objectSchema } from './fields';
import { SRC_COPPER, SRC_FLOYD } from './sources';
import type { Calculator, InputMeta } from './types';

export interface CableInput {
  current_A: number;
  length_m: number;
  crossSection_mm2: number;
  temperature_C: number;
  systemVoltage_V: number;
}

export type CableOutput = {
  resistance_ohm: number;
  voltageDrop_V: number;
  voltageDropPercent: number;
  powerLoss_W: number;
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
];

/** Resistance of a copper conductor, Ω. */
export function copperResistance(length_m: number, area_mm2: number, tempC: number): number {
  return ((RHO20_CU * length_m) / (area_mm2 * 1e-6)) * (1 + ALPHA20_CU * (tempC - 20));
}

export const cableCalculator: Calculator<CableInput, CableOutput> = {
  kind: 'cable',
  title: 'Cable voltage drop',
  summary:
    'Loop resistance, voltage drop and loss of a two-wire copper DC run by length, cross-section and conductor temperature.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<CableInput>,
  inputs,
  outputs: [
    { name: 'resistance_ohm', label: 'Loop resistance', unit: 'Ω', digits: 5 },
    { name: 'voltageDrop_V', label: 'Voltage drop', unit: 'V', digits: 3 },
    { name: 'voltageDropPercent', label: 'Voltage drop', unit: '%', digits: 2 },
    { name: 'powerLoss_W', label: 'Power loss', unit: 'W', digits: 1 },
  ],
  sources: [SRC_COPPER, SRC_FLOYD],
  cautions: [CAUTION_BATTERY, CAUTION_CABLE, CAUTION_DEFER],
  compute(input) {
    const R = copperResistance(2 * input.length_m, input.crossSection_mm2, input.temperature_C);
    const dV = input.current_A * R;
    const pct = (100 * dV) / input.systemVoltage_V;
    const warnings: string[] = [];
    if (pct > 3)
      warnings.push(
        `Voltage drop ${pct.toFixed(1)} % is above the 3 % often used as a limit for DC feeders (common practice).`,
      );
    const density = input.current_A / input.crossSection_mm2;
    if (density > 5)
      warnings.push(
        `Current density ${density.toFixed(1)} A/mm² is above the ~5 A/mm² often used for continuous duty in free air (common practice): check the cable's ampacity for its insulation, bundling and ambient temperature.`,
      );
    return {
      outputs: { resistance_ohm: R, voltageDrop_V: dV, voltageDropPercent: pct, powerLoss_W: input.current_A * dV },
      warnings,
    };
  },
};
