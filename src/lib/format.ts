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

/** Numbers for people: fixed decimals, thin grouping, and very large or small values in exponent form. */
export function formatNumber(value: unknown, digits = 3): string {
  if (value === null || value === undefined || value === '') return '–';
  if (typeof value !== 'number') return plainText(value);
  if (!Number.isFinite(value)) return value > 0 ? '∞' : value < 0 ? '−∞' : '–';
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e7 || abs < 10 ** -Math.max(digits, 1)))
    return value.toExponential(Math.max(2, Math.min(digits, 6))).replace('-', '−');
  return formatter(digits).format(value).replace('-', '−');
}

/** An input as the person typed it: whole numbers stay whole, decimals keep their own places (up to 6). */
export function formatInputValue(value: unknown, kind?: string): string {
  if (typeof value !== 'number') return value === null || value === undefined ? '–' : plainText(value);
  if (kind === 'integer' || Number.isInteger(value)) return formatNumber(value, 0);
  const places = Math.min(6, (String(value).split('.')[1] ?? '').length);
  return formatNumber(value, places);
}
