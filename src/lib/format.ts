// Numbers for people, in one place: fixed decimals with grouping, SI prefixes on units that take them, and
// "× 10ⁿ" (never "e+7") for the rare dimensionless value too large or small for fixed decimals. Pure.

// toLocaleString() with options builds a new Intl.NumberFormat on every call; a chart's data table formats
// hundreds of numbers per page, so keep one formatter per number of decimals.
const formatters = new Map<number, Intl.NumberFormat>();
function formatter(digits: number): Intl.NumberFormat {
  let f = formatters.get(digits);
  if (!f)
    formatters.set(
      digits,
      (f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })),
    );
  return f;
}

const MINUS = '−';
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** Fixed decimals with a real minus sign. */
function fixed(value: number, decimals: number): string {
  const text = formatter(decimals).format(value);
  return /[1-9]/.test(text) ? text.replace('-', MINUS) : text.replace('-', ''); // no "−0.00"
}

/** Decimals that show `significant` figures of a value (at least 0). */
function decimalsFor(value: number, significant: number): number {
  if (value === 0) return 0;
  return Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(value))));
}

/** 2.74 × 10⁷: the typographic form, for dimensionless values fixed decimals cannot show. */
function scientific(value: number, significant = 3): string {
  let exponent = Math.floor(Math.log10(Math.abs(value)));
  let mantissa = Number((value / 10 ** exponent).toFixed(significant - 1));
  if (Math.abs(mantissa) >= 10) {
    mantissa /= 10;
    exponent += 1;
  }
  const power = String(exponent)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
  return `${fixed(mantissa, significant - 1)} × 10${power}`;
}

/** Any value as text: strings as they are, other primitives as `String()` writes them, objects as JSON. */
export function plainText(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean' || typeof value === 'bigint') return String(value);
  if (value === null || value === undefined) return '';
  try {
    return JSON.stringify(value) ?? '';
  } catch {
    return ''; // a cycle: nothing sensible to show
  }
}

function special(value: unknown): string | null {
  if (value === null || value === undefined || value === '') return '–';
  if (typeof value !== 'number') return plainText(value);
  if (!Number.isFinite(value)) return value > 0 ? '∞' : value < 0 ? `${MINUS}∞` : '–';
  return null;
}

/**
 * A number with `digits` decimals and grouping. Values of a million and more drop their decimals; beyond 10¹² or
 * too small for the decimals asked, the "× 10ⁿ" form.
 */
export function formatNumber(value: unknown, digits = 3): string {
  const s = special(value);
  if (s !== null) return s;
  const v = value as number;
  const abs = Math.abs(v);
  if (abs === 0) return fixed(0, digits);
  if (abs >= 1e12 || abs < 10 ** -Math.max(digits, 1)) return scientific(v);
  return fixed(v, abs >= 1e6 ? 0 : digits);
}

/** Units that take SI prefixes, each with the prefixed forms we show (factor to the base unit). */
const PREFIXED: Record<string, [string, number][]> = {
  W: [
    ['mW', 1e-3],
    ['W', 1],
    ['kW', 1e3],
    ['MW', 1e6],
  ],
  Wh: [
    ['mWh', 1e-3],
    ['Wh', 1],
    ['kWh', 1e3],
    ['MWh', 1e6],
  ],
  J: [
    ['mJ', 1e-3],
    ['J', 1],
    ['kJ', 1e3],
    ['MJ', 1e6],
  ],
  N: [
    ['mN', 1e-3],
    ['N', 1],
    ['kN', 1e3],
    ['MN', 1e6],
  ],
  'N·m': [
    ['mN·m', 1e-3],
    ['N·m', 1],
    ['kN·m', 1e3],
  ],
  Pa: [
    ['mPa', 1e-3],
    ['Pa', 1],
    ['kPa', 1e3],
    ['MPa', 1e6],
  ],
  'Pa·s': [
    ['µPa·s', 1e-6],
    ['mPa·s', 1e-3],
    ['Pa·s', 1],
  ],
  V: [
    ['mV', 1e-3],
    ['V', 1],
    ['kV', 1e3],
  ],
  A: [
    ['mA', 1e-3],
    ['A', 1],
    ['kA', 1e3],
  ],
  Ω: [
    ['µΩ', 1e-6],
    ['mΩ', 1e-3],
    ['Ω', 1],
    ['kΩ', 1e3],
  ],
  'm²/s': [
    ['mm²/s', 1e-6],
    ['m²/s', 1],
  ],
};

export interface Quantity {
  /** The number as shown, e.g. "1.003". */
  value: string;
  /** Its unit, prefixed when the value needed it, e.g. "mm²/s"; '' for none. */
  unit: string;
}

/**
 * A value with its unit for people. Units that take SI prefixes stay in their base unit between 0.1 and 100 000
 * (with `digits` decimals), and outside that move to the prefix that puts the number between 1 and 1000, shown to
 * four significant figures: 1.0034·10⁻⁶ m²/s is "1.003 mm²/s", 2.74·10⁷ W is "27.40 MW". Other units keep their
 * unit and use formatNumber.
 */
export function formatQuantity(value: unknown, unit: string, digits = 3): Quantity {
  const s = special(value);
  if (s !== null) return { value: s, unit };
  const v = value as number;
  const abs = Math.abs(v);
  const prefixes = PREFIXED[unit];
  if (!prefixes || abs === 0 || (abs >= 0.1 && abs < 1e5)) return { value: formatNumber(v, digits), unit };
  let [name, factor] = prefixes[0];
  for (const [n, f] of prefixes) if (abs >= f) [name, factor] = [n, f];
  const mantissa = v / factor;
  if (Math.abs(mantissa) >= 1e4 || Math.abs(mantissa) < 1e-3) return { value: formatNumber(v, digits), unit };
  return { value: fixed(mantissa, decimalsFor(mantissa, 4)), unit: name };
}

/** formatQuantity as one string: "1.003 mm²/s", "0.85" (no unit). */
export function formatWithUnit(value: unknown, unit: string, digits = 3): string {
  const q = formatQuantity(value, unit, digits);
  return q.unit ? `${q.value} ${q.unit}` : q.value;
}

/** An input as the person typed it: whole numbers stay whole, decimals keep their own places (up to 6). */
export function formatInputValue(value: unknown, kind?: string): string {
  if (typeof value !== 'number') return value === null || value === undefined ? '–' : plainText(value);
  if (kind === 'integer' || Number.isInteger(value)) return formatNumber(value, 0);
  const places = Math.min(6, (String(value).split('.')[1] ?? '').length);
  return formatNumber(value, places);
}
