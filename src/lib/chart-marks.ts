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

/**
 * The point a chart's legend reads while nobody points at the chart: of the entries with a finite x and y, the one
 * whose x is nearest `atX` (the operating point), or the last one when no x is given. null when there is none.
 */
export function restingIndex(
  xs: ArrayLike<number | null | undefined>,
  ys: ArrayLike<number | null | undefined>,
  atX?: number,
): number | null {
  let best: number | null = null;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const y = ys[i];
    if (typeof x !== 'number' || !Number.isFinite(x) || typeof y !== 'number' || !Number.isFinite(y)) continue;
    if (best === null || atX === undefined || Math.abs(x - atX) < Math.abs((xs[best] as number) - atX)) best = i;
  }
  return best;
}

/** A line's value at `x`, straight between its two neighbouring points (x ascending); null outside its points. */
export function valueAt(
  xs: ArrayLike<number | null | undefined>,
  ys: ArrayLike<number | null | undefined>,
  x: number,
): number | null {
  let prev: [number, number] | null = null;
  for (let i = 0; i < xs.length; i++) {
    const xi = xs[i];
    const yi = ys[i];
    if (typeof xi !== 'number' || !Number.isFinite(xi) || typeof yi !== 'number' || !Number.isFinite(yi)) continue;
    if (xi === x) return yi;
    if (prev && (prev[0] - x) * (xi - x) < 0) return prev[1] + ((yi - prev[1]) * (x - prev[0])) / (xi - prev[0]);
    prev = [xi, yi];
  }
  return null;
}
