// Units carried in field and column names, the way the calculators and API.md name them (`speed_mps`,
// `temperature_C`): one table, so a CSV log whose columns follow the same habit gets the same units. Pure.

/** Name suffix → unit as shown. Case matters: `_C` is °C, `_K` is kelvin, `_m` metres, `_mm` millimetres. */
export const UNIT_SUFFIXES: Readonly<Record<string, string>> = Object.freeze({
  s: 's',
  ms: 'ms',
  min: 'min',
  h: 'h',
  m: 'm',
  mm: 'mm',
  km: 'km',
  m2: 'm²',
  mm2: 'mm²',
  m3: 'm³',
  mps: 'm/s',
  kmh: 'km/h',
  kn: 'kn',
  N: 'N',
  kN: 'kN',
  Nm: 'N·m',
  W: 'W',
  kW: 'kW',
  Wh: 'Wh',
  kWh: 'kWh',
  J: 'J',
  Wm2: 'W/m²',
  C: '°C',
  K: 'K',
  KperW: 'K/W',
  perK: '1/K',
  Pa: 'Pa',
  kPa: 'kPa',
  bar: 'bar',
  Pas: 'Pa·s',
  kgm3: 'kg/m³',
  m2s: 'm²/s',
  kg: 'kg',
  lpm: 'L/min',
  rpm: 'rpm',
  Hz: 'Hz',
  A: 'A',
  Ah: 'Ah',
  V: 'V',
  mV: 'mV',
  ohm: 'Ω',
  pct: '%',
  percent: '%',
  deg: '°',
});

export interface NamedQuantity {
  /** The name without its unit suffix, words separated: "motor temp". */
  label: string;
  /** '' when the name carries no known unit. */
  unit: string;
}

/**
 * Splits a field or column name into a label and a unit: `motorTemp_C` → {label: "Motor temp", unit: "°C"},
 * `speed_mps` → {label: "Speed", unit: "m/s"}, `time_s` → {label: "Time", unit: "s"}. A name without a known
 * suffix keeps its whole text as the label (and no unit).
 */
export function unitFromName(name: string): NamedQuantity {
  const trimmed = name.trim();
  const m = /^(.*[^ _])[ _]+([A-Za-z0-9]+)$/.exec(trimmed);
  const unit = m ? UNIT_SUFFIXES[m[2]] : undefined;
  if (unit === undefined || !m) return { label: trimmed, unit: '' };
  return { label: readableWords(m[1]), unit };
}

/**
 * A machine name as words: `motorTemp` → "Motor temp", `boat_speed` → "Boat speed", `cell-V max` → "Cell V max".
 * Capitalised words after the first are lowered; words in capitals (SOC, GPS) stay as they are.
 */
export function readableWords(name: string): string {
  const words = name
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .split(/[\s_-]+/)
    .filter(Boolean)
    .map((w, i) => (i > 0 && /^[A-Z][a-z]+$/.test(w) ? w.toLowerCase() : w));
  if (words[0]) words[0] = words[0][0].toUpperCase() + words[0].slice(1);
  return words.join(' ');
}
