// Where a chart marks the point the person is looking at: a chart whose x axis is a quantity the calculation also
// has as an output or an input (the propeller's advance ratio, the race's sustained speed, the solar irradiance)
// gets a vertical mark at that value. Works for any calculator that names its axes like its fields. Pure.
import type { SeriesSet } from './calc/types';
import { formatNumber } from './format';

export interface ChartMark {
  x: number;
  label: string;
}

export function operatingPoints(
  set: SeriesSet,
  outputs: Record<string, unknown>,
  inputs: Record<string, unknown> = {},
): ChartMark[] {
  const name = set.x.name;
  const fromOutput = typeof outputs[name] === 'number';
  const value = fromOutput ? outputs[name] : inputs[name];
  if (typeof value !== 'number' || !Number.isFinite(value)) return [];
  const xs = set.x.values.filter(Number.isFinite);
  if (xs.length === 0 || value < Math.min(...xs) || value > Math.max(...xs)) return [];
  const shown = `${set.x.label} = ${formatNumber(value, 3)}${set.x.unit ? ` ${set.x.unit}` : ''}`;
  return [{ x: value, label: `${fromOutput ? 'Operating point' : 'This case'}: ${shown}` }];
}
