import type { z } from 'zod';

export interface InputMeta {
  name: string;
  label: string;
  /** '' if none; e.g. 'm', 'm/s', 'rpm', '°C', 'W' */
  unit: string;
  kind: 'number' | 'integer' | 'choice';
  min?: number;
  max?: number;
  step?: number;
  default?: number | string;
  options?: { value: string; label: string }[];
  optional?: boolean;
  help: string;
  group?: string;
  /**
   * Shown and used only while the choice input `input` has one of the values `is`. A hidden input never feeds
   * the result: the form leaves it out and the schema drops it (see `activeInputs` in fields.ts).
   */
  when?: { input: string; is: string[] };
}

export interface OutputMeta {
  name: string;
  label: string;
  unit: string;
  /** significant display decimals */
  digits: number;
  help?: string;
}

export interface Source {
  /** full: authors, year, title, publication, table */
  citation: string;
  /** what it is used for */
  use: string;
}

export interface Axis {
  name: string;
  label: string;
  unit: string;
  values: number[];
}

/** For line charts (uPlot). */
export interface SeriesSet {
  title: string;
  x: Axis;
  y: Axis[];
}

export interface Grid {
  title: string;
  x: Axis;
  y: Axis;
  /** values are [yIndex][xIndex] */
  z: { name: string; label: string; unit: string; values: (number | null)[][] };
  /** cells that fail a check ([yIndex][xIndex]); shown greyed out, with `failedLabel` saying why */
  failed?: boolean[][];
  failedLabel?: string;
  /** cells to mark, e.g. the best pick, by their x and y values */
  picks?: { x: number; y: number; label: string }[];
}

export interface CalcResult<O> {
  outputs: O;
  series?: Record<string, SeriesSet>;
  grid?: Grid;
  /** further grids, shown after `grid` */
  grids?: Grid[];
  warnings: string[];
}

export interface Calculator<I, O extends Record<string, number | string | null>> {
  kind: string;
  title: string;
  summary: string;
  /** semver, bump when results change */
  engineVersion: string;
  /** parses raw JSON inputs, applies defaults, checks types & generic ranges */
  inputSchema: z.ZodType<I>;
  inputs: InputMeta[];
  outputs: OutputMeta[];
  sources: Source[];
  /** safety cautions shown on screen ([] when none apply) */
  cautions: string[];
  /** throws OutOfRangeError when valid in form but outside the method's validity */
  compute(input: I): CalcResult<O>;
}
