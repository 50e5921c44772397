// A saved calculation's inputs in words, for search snippets and lists: "Blades 3, pitch ratio 1, diameter 0.2 m".
// Labels and units come from each calculator's own metadata, so new kinds are described without changes here. Pure.
import { getCalculator } from './calc';
import { activeInputs } from './calc/fields';
import { formatInputValue } from './format';

/** "Pitch ratio P/D" → "Pitch ratio": a trailing symbol goes when words remain that say what it is. */
function plainLabel(label: string): string {
  const words = label.split(/\s+/);
  if (words.length < 2) return label;
  const last = words[words.length - 1];
  const symbol = last.length <= 3 || /[_\u0370-\u03ff]/.test(last);
  const rest = words.slice(0, -1);
  return symbol && (last.length <= 3 || rest.length >= 2) ? rest.join(' ') : label;
}

/** Lower-cases a label's first letter unless it starts an acronym ("NOCT", "Re"). */
function lowerFirst(label: string): string {
  return /^[A-Z][a-z]/.test(label) ? label[0].toLowerCase() + label.slice(1) : label;
}

export function describeInputs(kind: string, inputs: Record<string, unknown>): string {
  const calc = getCalculator(kind);
  if (!calc) return '';
  const parts: string[] = [];
  for (const m of activeInputs(calc.inputs, inputs)) {
    const v = inputs[m.name];
    if (v === undefined || v === null || v === '') continue;
    const option = m.options?.find((o) => o.value === v);
    const value = option ? option.label : `${formatInputValue(v, m.kind)}${m.unit ? ` ${m.unit}` : ''}`;
    const label = plainLabel(m.label);
    parts.push(`${parts.length === 0 ? label : lowerFirst(label)} ${value}`);
  }
  return parts.join(', ');
}
