// Units of a test log's columns from their suffixes ("speed_mps", "power_kW", "temp_C"), and conversion to the units
// a calculator's curves use, so a log can be drawn over a prediction. Pure; used by the test-log island.
import { readableWords, unitFromName, UNIT_SUFFIXES } from './units';

interface UnitInfo {
  /** unit as the calculators write it */
  unit: string;
  /** the calculator unit it converts to, and the factor (value × factor) */
  base: string;
  factor: number;
  offset?: number;
}

const SUFFIXES: Record<string, UnitInfo> = {
  mps: { unit: 'm/s', base: 'm/s', factor: 1 },
  kn: { unit: 'kn', base: 'm/s', factor: 1852 / 3600 },
  kts: { unit: 'kn', base: 'm/s', factor: 1852 / 3600 },
  kmh: { unit: 'km/h', base: 'm/s', factor: 1 / 3.6 },
  w: { unit: 'W', base: 'W', factor: 1 },
  kw: { unit: 'kW', base: 'W', factor: 1000 },
  n: { unit: 'N', base: 'N', factor: 1 },
  kn_force: { unit: 'kN', base: 'N', factor: 1000 },
  a: { unit: 'A', base: 'A', factor: 1 },
  v: { unit: 'V', base: 'V', factor: 1 },
  c: { unit: '°C', base: '°C', factor: 1 },
  degc: { unit: '°C', base: '°C', factor: 1 },
  k: { unit: 'K', base: 'K', factor: 1 },
  s: { unit: 's', base: 's', factor: 1 },
  min: { unit: 'min', base: 's', factor: 60 },
  h: { unit: 'h', base: 's', factor: 3600 },
  rpm: { unit: 'rpm', base: 'rpm', factor: 1 },
  nm: { unit: 'N·m', base: 'N·m', factor: 1 },
  m: { unit: 'm', base: 'm', factor: 1 },
  deg: { unit: '°', base: '°', factor: 1 },
  pct: { unit: '%', base: '%', factor: 1 },
  lpm: { unit: 'L/min', base: 'L/min', factor: 1 },
};

export interface LogColumn {
  /** the header as written */
  header: string;
  /** the header without its unit suffix, e.g. "speed" */
  label: string;
  /** '' when the suffix is not a unit we know */
  unit: string;
}

/** Splits "speed_mps" into label "speed" and unit "m/s"; an unknown or missing suffix gives unit ''. */
export function logColumn(header: string): LogColumn {
  const m = /^(.*?)[_ ]\(?([A-Za-z]+)\)?$/.exec(header.trim());
  if (m) {
    const key = m[2].toLowerCase();
    // "kN" is kilonewton in a force column and knot elsewhere: logs of speed write kn/kts, of force kN.
    const info = m[2] === 'kN' ? SUFFIXES.kn_force : SUFFIXES[key];
    if (info) return { header, label: m[1] || header, unit: info.unit };
  }
  return { header, label: header, unit: '' };
}

function infoOf(unit: string): UnitInfo | undefined {
  return Object.values(SUFFIXES).find((u) => u.unit === unit);
}

/** Factor and offset that convert a value in `from` to `to`, or null when they measure different things. */
export function unitConversion(from: string, to: string): ((v: number) => number) | null {
  if (from === to) return (v) => v;
  const a = infoOf(from);
  const b = infoOf(to);
  if (!a || !b || a.base !== b.base) return null;
  return (v) => (v * a.factor) / b.factor;
}

/**
 * A column's header as people read it: `thrust_N` → "Thrust (N)", `boat_speed_kts` → "Boat speed (kn)",
 * `motorTemp_C` → "Motor temp (°C)", `rpm` → "rpm". A header without a known unit suffix stays its own words (`lap_count` → "Lap
 * count", `Speed (m/s)` as written). Screens keep the header itself at hand (a title) for people who know the file.
 */
export function columnLabel(header: string): string {
  // A column named by its unit alone ("rpm", "V") is read as that unit.
  const bare = header.trim();
  if (UNIT_SUFFIXES[bare]) return UNIT_SUFFIXES[bare];
  const named = unitFromName(header);
  if (named.unit) return `${named.label} (${named.unit})`;
  const col = logColumn(header);
  if (col.unit) return `${readableWords(col.label)} (${col.unit})`;
  return readableWords(header.trim()) || 'Unnamed column';
}
