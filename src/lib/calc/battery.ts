// Battery pack from its cells: S cells in series, P strings in parallel, each cell an open-circuit voltage behind
// a resistance (the simplest equivalent circuit). A power load draws I from P = I·(V − I·R); a current load is
// given directly. Rate effects on capacity (Peukert) and the voltage's fall with state of charge are left out.
import { z } from 'zod';
import { CAUTION_BATTERY, CAUTION_DEFER } from './cautions';
import { int, num, objectSchema } from './fields';
import { linspace } from './numeric';
import { SRC_BATTERY_ECM } from './sources';
import type { Calculator, InputMeta, SeriesSet } from './types';

export interface BatteryInput {
  cellsSeries: number;
  cellsParallel: number;
  cellCapacity_Ah: number;
  cellNominal_V: number;
  cellResistance_ohm: number;
  cellMaxContinuous_A: number;
  power_W: number;
  current_A?: number;
}

export type BatteryOutput = {
  packNominal_V: number;
  packCapacity_Ah: number;
  packEnergy_Wh: number;
  packResistance_ohm: number;
  current_A: number | null;
  cellCurrent_A: number | null;
  loadVoltage_V: number | null;
  loadPower_W: number | null;
  heat_W: number | null;
  cRate: number | null;
  runtime_h: number | null;
  maxPower_W: number | null;
};

const C = 'Cells';
const L = 'Load';
const inputs: InputMeta[] = [
  int({
    name: 'cellsSeries',
    label: 'Cells in series S',
    unit: '',
    min: 1,
    max: 1000,
    default: 14,
    group: C,
    help: 'Cells (or parallel groups) in series; pack voltage = S × cell voltage (demo default 14S).',
  }),
  int({
    name: 'cellsParallel',
    label: 'Strings in parallel P',
    unit: '',
    min: 1,
    max: 1000,
    default: 10,
    group: C,
    help: 'Cells in parallel in each group; pack capacity = P × cell capacity (demo default 10P).',
  }),
  num({
    name: 'cellCapacity_Ah',
    label: 'Cell capacity',
    unit: 'Ah',
    min: 0.01,
    max: 1000,
    step: 0.1,
    default: 3.5,
    group: C,
    help: 'Rated capacity of one cell from its datasheet (demo default 3.5 Ah, an 18650-size cell).',
  }),
  num({
    name: 'cellNominal_V',
    label: 'Cell nominal voltage',
    unit: 'V',
    min: 0.5,
    max: 10,
    step: 0.01,
    default: 3.6,
    group: C,
    help: 'Nominal voltage of one cell (3.6–3.7 V for NMC/NCA lithium-ion, 3.2 V for LiFePO₄).',
  }),
  num({
    name: 'cellResistance_ohm',
    label: 'Cell internal resistance',
    unit: 'Ω',
    min: 0,
    max: 10,
    step: 0.001,
    default: 0.03,
    group: C,
    help: 'DC internal resistance of one cell (datasheet or a pulse test; rises in the cold and with age; demo default 30 mΩ).',
  }),
  num({
    name: 'cellMaxContinuous_A',
    label: 'Cell maximum continuous current',
    unit: 'A',
    min: 0.01,
    max: 5000,
    step: 0.5,
    default: 10,
    group: C,
    help: 'Highest continuous discharge current of one cell from its datasheet (demo default 10 A).',
  }),
  num({
    name: 'power_W',
    label: 'Load power',
    unit: 'W',
    min: 0,
    max: 1000000,
    step: 10,
    default: 1500,
    group: L,
    help: 'Power the load draws at the pack terminals (demo default 1.5 kW). Ignored when a current is given.',
  }),
  num({
    name: 'current_A',
    label: 'Load current',
    unit: 'A',
    min: 0,
    max: 100000,
    step: 0.5,
    optional: true,
    group: L,
    help: 'Give a current instead of a power (e.g. the controller’s battery-current limit); leave empty to use the power.',
  }),
];

interface PackState {
  current: number;
  loadVoltage: number;
}

/** Current for a power load P from P = I·(V − I·R): the smaller root; null when P exceeds V²/(4R). */
export function currentForPower(V: number, R: number, P: number): number | null {
  if (P <= 0) return 0;
  if (R === 0) return P / V;
  const disc = V * V - 4 * R * P;
  if (disc < 0) return null;
  // (V − √disc)/(2R), written to keep precision when 4RP ≪ V²
  return (2 * P) / (V + Math.sqrt(disc));
}

export const batteryCalculator: Calculator<BatteryInput, BatteryOutput> = {
  kind: 'battery',
  title: 'Battery pack',
  summary:
    'Pack voltage, capacity, energy and resistance from its cells, and what a load in power or current does to it: current, voltage under load, heat, C-rate and runtime, with warnings when a cell’s continuous current is exceeded or the pack cannot carry the load.',
  engineVersion: '1.0.0',
  inputSchema: objectSchema(inputs) as unknown as z.ZodType<BatteryInput>,
  inputs,
  outputs: [
    { name: 'packNominal_V', label: 'Pack nominal voltage', unit: 'V', digits: 1, help: 'S × cell voltage.' },
    { name: 'packCapacity_Ah', label: 'Pack capacity', unit: 'Ah', digits: 1, help: 'P × cell capacity.' },
    { name: 'packEnergy_Wh', label: 'Pack energy', unit: 'Wh', digits: 0, help: 'Nominal voltage × capacity.' },
    {
      name: 'packResistance_ohm',
      label: 'Pack resistance',
      unit: 'Ω',
      digits: 4,
      help: 'R_cell · S / P (cells only; add busbars, fuse and cables).',
    },
    { name: 'current_A', label: 'Pack current', unit: 'A', digits: 1, help: 'From P = I·(V − I·R) for a power load.' },
    { name: 'cellCurrent_A', label: 'Current per cell', unit: 'A', digits: 2 },
    { name: 'loadVoltage_V', label: 'Voltage under load', unit: 'V', digits: 1, help: 'V − I·R.' },
    { name: 'loadPower_W', label: 'Power delivered to the load', unit: 'W', digits: 0 },
    { name: 'heat_W', label: 'Heat in the cells', unit: 'W', digits: 1, help: 'I²·R.' },
    { name: 'cRate', label: 'C-rate', unit: '1/h', digits: 2, help: 'Current over pack capacity.' },
    {
      name: 'runtime_h',
      label: 'Runtime at this load',
      unit: 'h',
      digits: 2,
      help: 'Capacity over current, at the rated capacity (no rate or temperature derating).',
    },
    {
      name: 'maxPower_W',
      label: 'Most power the pack can deliver',
      unit: 'W',
      digits: 0,
      help: 'V²/(4R), at half the voltage: far beyond what the cells tolerate, a theoretical ceiling.',
    },
  ],
  sources: [SRC_BATTERY_ECM],
  cautions: [
    CAUTION_BATTERY,
    'Lithium cells that are overcharged, over-discharged, crushed, shorted or run hot can go into thermal runaway: use a battery management system with cell-level voltage and temperature protection, charge only in a supervised place, and keep a fire plan.',
    CAUTION_DEFER,
  ],
  compute(input) {
    const S = input.cellsSeries;
    const P = input.cellsParallel;
    const V = S * input.cellNominal_V;
    const capacity = P * input.cellCapacity_Ah;
    const R = (input.cellResistance_ohm * S) / P;
    const maxPower = R > 0 ? (V * V) / (4 * R) : Infinity;
    const warnings: string[] = [];
    let state: PackState | null = null;
    if (input.current_A !== undefined) {
      const loadVoltage = V - input.current_A * R;
      if (loadVoltage <= 0)
        warnings.push(
          `The pack cannot carry ${input.current_A} A: its internal resistance would take the whole voltage (${(V / R).toFixed(0)} A is a dead short).`,
        );
      else state = { current: input.current_A, loadVoltage };
    } else {
      const I = currentForPower(V, R, input.power_W);
      if (I === null)
        warnings.push(
          `The pack cannot carry ${input.power_W.toFixed(0)} W: through its ${R.toFixed(3)} Ω it can deliver at most ${maxPower.toFixed(0)} W (at half its voltage). Add cells in parallel or lower the load.`,
        );
      else state = { current: I, loadVoltage: V - I * R };
    }
    const cellCurrent = state ? state.current / P : null;
    if (cellCurrent !== null && cellCurrent > input.cellMaxContinuous_A)
      warnings.push(
        `Each cell would carry ${cellCurrent.toFixed(1)} A, above its ${input.cellMaxContinuous_A} A continuous rating: add strings in parallel, lower the load, or choose a higher-rated cell.`,
      );
    if (state && state.loadVoltage < 0.8 * V)
      warnings.push(
        `The voltage sags to ${((100 * state.loadVoltage) / V).toFixed(0)} % of nominal under this load: the controller may cut out at low voltage and the cells run hot.`,
      );
    const maxI = Math.min(input.cellMaxContinuous_A * P, R > 0 ? V / (2 * R) : input.cellMaxContinuous_A * P);
    const currents = linspace(0, maxI, 31);
    const series: SeriesSet = {
      title: 'Voltage under load and heat against current',
      x: { name: 'current_A', label: 'Pack current', unit: 'A', values: currents },
      y: [
        { name: 'loadVoltage_V', label: 'Voltage under load', unit: 'V', values: currents.map((i) => V - i * R) },
        { name: 'heat_W', label: 'Heat in the cells', unit: 'W', values: currents.map((i) => i * i * R) },
      ],
    };
    const I = state?.current ?? null;
    return {
      outputs: {
        packNominal_V: V,
        packCapacity_Ah: capacity,
        packEnergy_Wh: V * capacity,
        packResistance_ohm: R,
        current_A: I,
        cellCurrent_A: cellCurrent,
        loadVoltage_V: state?.loadVoltage ?? null,
        loadPower_W: state ? state.current * state.loadVoltage : null,
        heat_W: I === null ? null : I * I * R,
        cRate: I === null ? null : I / capacity,
        runtime_h: I === null ? null : I > 0 ? capacity / I : null,
        maxPower_W: Number.isFinite(maxPower) ? maxPower : null,
      },
      series: { load: series },
      warnings,
    };
  },
};
