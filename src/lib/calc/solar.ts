// Solar array output: Ross NOCT or Faiman cell temperature and the PVWatts linear temperature model.
import { z } from 'zod';
import { choice, num, objectSchema } from './fields';
import { SRC_FAIMAN, SRC_PVLIB, SRC_PVLIB_FAIMAN, SRC_PVWATTS, SRC_ROSS } from './sources';
import { linspace } from './numeric';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface SolarInput {
  area_m2: number;
  moduleEfficiency: number;
  irradiance_Wm2: number;
  ambient_C: number;
  noct_C: number;
  tempCoefficient_perK: number;
  otherLosses: number;
  windSpeed_mps: number;
  cellTemperatureModel: 'noct' | 'faiman';
  faimanU0: number;
  faimanU1: number;
}

export type SolarOutput = { cellTemperature_C: number; power_W: number; ratedPower_W: number };

const inputs: InputMeta[] = [
  num({
    name: 'area_m2',
    label: 'Array area',
    unit: 'm²',
    min: 0.01,
    max: 50,
    step: 0.05,
    default: 1.8,
    group: 'Array',
    help: 'Total module area (demo default 1.8 m²; check your class rules for the limit).',
  }),
  num({
    name: 'moduleEfficiency',
    label: 'Module efficiency',
    unit: '',
    min: 0.01,
    max: 0.5,
    step: 0.005,
    default: 0.22,
    group: 'Array',
    help: 'Efficiency at STC (1000 W/m², 25 °C cell, AM1.5) from the datasheet, as a fraction.',
  }),
  num({
    name: 'irradiance_Wm2',
    label: 'Irradiance G',
    unit: 'W/m²',
    min: 0,
    max: 1500,
    step: 10,
    default: 800,
    group: 'Conditions',
    help: 'Plane-of-array irradiance. 800 W/m² is NOCT conditions; a clear summer noon is about 1000 W/m².',
  }),
  num({
    name: 'ambient_C',
    label: 'Air temperature T_a',
    unit: '°C',
    min: -30,
    max: 60,
    step: 0.5,
    default: 25,
    group: 'Conditions',
    help: 'Ambient air temperature.',
  }),
  num({
    name: 'noct_C',
    label: 'NOCT',
    unit: '°C',
    min: 20,
    max: 100,
    step: 0.5,
    default: 45,
    group: 'Array',
    help: 'Nominal operating cell temperature from the datasheet (open rack, 800 W/m², 20 °C air, 1 m/s wind). Deck-mounted panels run hotter: raise it for flush mounting.',
  }),
  num({
    name: 'tempCoefficient_perK',
    label: 'Power temperature coefficient γ',
    unit: '1/K',
    min: -0.02,
    max: 0,
    step: 0.0001,
    default: -0.0035,
    group: 'Array',
    help: 'Relative change of power per kelvin, e.g. −0.0035 for −0.35 %/K.',
  }),
  num({
    name: 'otherLosses',
    label: 'Other losses',
    unit: '',
    min: 0,
    max: 0.9,
    step: 0.01,
    default: 0.1,
    group: 'Array',
    help: 'Fraction lost to soiling, mismatch, wiring and MPPT (demo default 0.10).',
  }),
  choice({
    name: 'cellTemperatureModel',
    label: 'Cell temperature model',
    unit: '',
    default: 'noct',
    group: 'Cell temperature',
    options: [
      { value: 'noct', label: 'NOCT (Ross)' },
      { value: 'faiman', label: 'Faiman (with wind)' },
    ],
    help: 'NOCT uses the datasheet’s nominal operating cell temperature; Faiman adds the cooling of the wind a moving boat sees.',
  }),
  num({
    name: 'windSpeed_mps',
    label: 'Wind over the panels',
    unit: 'm/s',
    min: 0,
    max: 30,
    step: 0.1,
    default: 1,
    group: 'Cell temperature',
    help: 'Air speed over the array (Faiman model): the boat’s own speed plus or minus the wind. 1 m/s is the NOCT condition.',
  }),
  num({
    name: 'faimanU0',
    label: 'Faiman U₀',
    unit: 'W/m²K',
    min: 1,
    max: 100,
    step: 0.1,
    default: 25,
    group: 'Cell temperature',
    help: 'Constant heat-loss coefficient (Faiman 2008: 25.0 W/m²K for open-rack modules; lower for panels flush on a deck).',
  }),
  num({
    name: 'faimanU1',
    label: 'Faiman U₁',
    unit: 'W·s/m³K',
    min: 0,
    max: 50,
    step: 0.01,
    default: 6.84,
    group: 'Cell temperature',
    help: 'Wind heat-loss coefficient (Faiman 2008: 6.84 W·s/m³K).',
  }),
];

/** Ross (1981): T_c = T_a + (NOCT − 20)/800 · G. */
export function rossCellTemperature(G: number, Ta: number, noct: number): number {
  return Ta + ((noct - 20) / 800) * G;
}

/** Faiman (2008): T_c = T_a + G/(U₀ + U₁·v). */
export function faimanCellTemperature(G: number, Ta: number, wind: number, u0 = 25, u1 = 6.84): number {
  return Ta + G / (u0 + u1 * wind);
}

/** PVWatts v5 DC model: P = P_STC · G/1000 · (1 + γ(T_c − 25)). */
export function pvwattsDc(G: number, Tc: number, pStc: number, gamma: number): number {
  return pStc * (G / 1000) * (1 + gamma * (Tc - 25));
}

export const solarCalculator: Calculator<SolarInput, SolarOutput> = {
  kind: 'solar',
  title: 'Solar array output',
  summary:
    'Cell temperature from the NOCT model or from Faiman’s model with the wind over the panels, and array DC power from irradiance, area, efficiency and temperature coefficient.',
  engineVersion: '1.1.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<SolarInput>,
  inputs,
  outputs: [
    { name: 'cellTemperature_C', label: 'Cell temperature T_c', unit: '°C', digits: 1 },
    { name: 'power_W', label: 'Array power', unit: 'W', digits: 0, help: 'After temperature and other losses.' },
    { name: 'ratedPower_W', label: 'Rated power P_STC', unit: 'W', digits: 0, help: 'area × efficiency × 1000 W/m²' },
  ],
  sources: [SRC_ROSS, SRC_FAIMAN, SRC_PVWATTS, SRC_PVLIB, SRC_PVLIB_FAIMAN],
  cautions: [],
  compute(input) {
    const pStc = input.area_m2 * input.moduleEfficiency * 1000;
    const faiman = input.cellTemperatureModel === 'faiman';
    const cellTemperature = (G: number) =>
      faiman
        ? faimanCellTemperature(G, input.ambient_C, input.windSpeed_mps, input.faimanU0, input.faimanU1)
        : rossCellTemperature(G, input.ambient_C, input.noct_C);
    const arrayPower = (G: number, Tc: number) =>
      Math.max(0, pvwattsDc(G, Tc, pStc, input.tempCoefficient_perK)) * (1 - input.otherLosses);
    const Tc = cellTemperature(input.irradiance_Wm2);
    // The day's range of sun on the same array: power and cell temperature from dawn light to a clear noon.
    const irradiances = linspace(0, Math.max(1200, input.irradiance_Wm2), 49);
    const temps = irradiances.map(cellTemperature);
    const x = { name: 'irradiance_Wm2', label: 'Irradiance G', unit: 'W/m²', values: irradiances };
    const power: SeriesSet = {
      title: 'Array power against irradiance',
      x,
      y: [
        {
          name: 'power_W',
          label: 'Array power',
          unit: 'W',
          values: irradiances.map((G, i) => arrayPower(G, temps[i])),
        },
      ],
    };
    const temperature: SeriesSet = {
      title: 'Cell temperature against irradiance',
      x,
      y: [{ name: 'cellTemperature_C', label: 'Cell temperature T_c', unit: '°C', values: temps }],
    };
    const warnings = [
      faiman
        ? 'Faiman’s U₀ and U₁ were fitted to open-rack modules: a panel flush on a deck loses heat from one face only, so lower U₀ (or measure the cell temperature) for a flush-mounted array.'
        : 'Deck-mounted panels are not in the open-rack condition NOCT is measured in: with little air behind them they run hotter than NOCT predicts, so raise NOCT (or measure the cell temperature) for a flush-mounted array.',
    ];
    if (!faiman && input.windSpeed_mps > 2)
      warnings.push(
        'The NOCT model ignores the wind speed given; choose the Faiman model to include the cooling of the air over a moving boat.',
      );
    if (input.irradiance_Wm2 > 1100)
      warnings.push('Irradiance above 1100 W/m² is unusual outside brief cloud-edge peaks; check the value.');
    return {
      outputs: { cellTemperature_C: Tc, power_W: arrayPower(input.irradiance_Wm2, Tc), ratedPower_W: pStc },
      series: { power, temperature },
      warnings,
    };
  },
};
