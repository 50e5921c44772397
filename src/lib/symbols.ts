// Engineering symbols written with an underscore for the subscript (`K_T`, `A_E/A_0`, `τ_c`, `C_p,min`), the way the
// calculators' labels and help carry them, turned into what a reader sees: a subscript in HTML (K<sub>T</sub>) and
// the subscript run together in plain text ("KT"), where markup cannot go (chart canvases, <option>, title). Only
// text meant for people goes through here; field keys (`speed_mps`) and CSV export headers stay machine names. Pure.

export interface SymbolPart {
  text: string;
  /** true: show as a subscript */
  sub: boolean;
}

// One letter (Latin or Greek) that is not the end of a longer Latin name, an underscore, then the subscript: letters
// and ASCII digits, with comma-joined parts ("p,min"). Superscripts such as ² end it, so V_R² is V, subscript R, then
// ². A longer name before the underscore (`friction_factor`, `test_ross`, `thrust_N`) is a machine name, left alone.
const SUBSCRIPT = /(?<=(?<![A-Za-z0-9_])\p{L})_([\p{L}0-9]+(?:,[\p{L}0-9]+)*)/gu;

/** Splits text into plain runs and subscripts: "10·K_Q" → ["10·K", sub "Q"]. Text without symbols is one run. */
export function symbolParts(text: string): SymbolPart[] {
  const parts: SymbolPart[] = [];
  let at = 0;
  for (const m of text.matchAll(SUBSCRIPT)) {
    if (m.index > at) parts.push({ text: text.slice(at, m.index), sub: false });
    parts.push({ text: m[1], sub: true });
    at = m.index + m[0].length;
  }
  if (at < text.length || parts.length === 0) parts.push({ text: text.slice(at), sub: false });
  return parts;
}

/** The same text for places without markup: the underscore dropped, "K_T" → "KT", "A_E/A_0" → "AE/A0". */
export function plainSymbols(text: string): string {
  return text.replace(SUBSCRIPT, '$1');
}
