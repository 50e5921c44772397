// Water density and kinematic viscosity, ITTC 7.5-02-01-03 (2011).
//
// How: the formulations themselves are implemented (no table): IAPWS-95 for pure-water density
// (properties/iapws95.ts), IAPWS 2008 for pure-water viscosity (properties/viscosity.ts), the IAPWS-08 /
// TEOS-10 saline Gibbs function for seawater density (properties/seawater.ts) and the Sharqawy et al. (2010)
// ratio for seawater viscosity — the same bases the ITTC procedure names. Every temperature between 0 and
// 40 °C is therefore computed, not interpolated. The published ITTC values at 15 and 20 °C are checked in
// tests/reference/water.test.ts. See properties/water.ts for the seawater reference pressure.
import { z } from 'zod';
import { choice, num, objectSchema, WATER_OPTIONS } from './fields';
import { waterProperties, type WaterKind } from './properties/water';
import { SRC_IAPWS08_SEA, SRC_IAPWS08_VISC, SRC_IAPWS95, SRC_ITTC_WATER, SRC_SHARQAWY } from './sources';
import type { Calculator, InputMeta } from './types';

export interface WaterInput {
  temperature_C: number;
  water: WaterKind;
}

export type WaterOutput = {
  density_kgm3: number;
  kinematicViscosity_m2s: number;
  dynamicViscosity_Pas: number;
};

export const temperatureInput = (group?: string): InputMeta =>
  num({
    name: 'temperature_C',
    label: 'Water temperature',
    unit: '°C',
    min: 0,
    max: 40,
    step: 0.5,
    default: 20,
    help: 'Temperature of the water the boat runs in (0–40 °C, the range of the ITTC table).',
    group,
  });

export const waterInput = (group?: string): InputMeta =>
  choice({
    name: 'water',
    label: 'Water',
    unit: '',
    default: 'fresh',
    options: WATER_OPTIONS,
    help: 'Fresh water (lakes, rivers, canals) or standard seawater (S_A 35.165 g/kg).',
    group,
  });

const inputs: InputMeta[] = [temperatureInput(), waterInput()];

export const waterCalculator: Calculator<WaterInput, WaterOutput> = {
  kind: 'water',
  title: 'Water properties',
  summary: 'Density and viscosity of fresh water or seawater by temperature, as the ITTC procedure computes them.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<WaterInput>,
  inputs,
  outputs: [
    { name: 'density_kgm3', label: 'Density ρ', unit: 'kg/m³', digits: 4 },
    { name: 'kinematicViscosity_m2s', label: 'Kinematic viscosity ν', unit: 'm²/s', digits: 10 },
    { name: 'dynamicViscosity_Pas', label: 'Dynamic viscosity μ', unit: 'Pa·s', digits: 8 },
  ],
  sources: [SRC_ITTC_WATER, SRC_IAPWS95, SRC_IAPWS08_VISC, SRC_IAPWS08_SEA, SRC_SHARQAWY],
  cautions: [],
  compute(input) {
    const p = waterProperties(input.temperature_C, input.water);
    return {
      outputs: {
        density_kgm3: p.density_kgm3,
        kinematicViscosity_m2s: p.kinematicViscosity_m2s,
        dynamicViscosity_Pas: p.dynamicViscosity_Pas,
      },
      warnings: [],
    };
  },
};
