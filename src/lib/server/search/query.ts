// Turns what a person typed into an FTS5 MATCH expression that can only mean "these words". Every term is
// re-quoted from our own tokens, so FTS5 syntax in the input (AND, OR, NOT, NEAR, *, ^, :, quotes, brackets, -)
// is read as plain words or dropped as punctuation, never as an operator.
import { tokenize } from './tokens';
import type { Highlighter } from './snippet';

export const MAX_TERMS = 8;
export const MAX_TERM_LENGTH = 64;
/** Prefix matching starts at this many characters: shorter prefixes expand to too many terms to be useful. */
export const MIN_PREFIX_LENGTH = 2;

export interface ParsedQuery {
  terms: string[];
}

export function parseQuery(raw: string): ParsedQuery {
  const seen = new Set<string>();
  const terms: string[] = [];
  for (const t of tokenize(raw)) {
    if (t.length > MAX_TERM_LENGTH || seen.has(t)) continue;
    seen.add(t);
    terms.push(t);
    if (terms.length === MAX_TERMS) break;
  }
  return { terms };
}

/** How one query term is matched, after the vocabulary has had its say. */
export type ResolvedTerm =
  | { term: string; match: 'exact' }
  /** `expand`: the prefix's known completions, when the vocabulary lists them (cheaper for FTS5 than a prefix scan). */
  | { term: string; match: 'prefix'; expand?: string[] }
  | { term: string; match: 'corrected'; to: string[] }
  | { term: string; match: 'none' };

function quote(term: string): string {
  // Tokens hold no quotes (tokenize keeps letters and digits only); doubling is the FTS5 escape all the same.
  return `"${term.replaceAll('"', '""')}"`;
}

function anyOf(terms: string[]): string {
  return terms.length === 1 ? quote(terms[0]) : `(${terms.map(quote).join(' OR ')})`;
}

/**
 * All terms must match (AND). A term with no match anywhere makes the whole query empty: the caller then answers
 * with no hits rather than silently dropping a word the person typed.
 */
export function toMatchExpression(terms: ResolvedTerm[]): string | null {
  if (terms.length === 0 || terms.some((t) => t.match === 'none')) return null;
  return terms
    .map((t) => {
      if (t.match === 'exact') return quote(t.term);
      if (t.match === 'prefix') return t.expand ? anyOf(t.expand) : `${quote(t.term)}*`;
      if (t.match === 'corrected') return anyOf(t.to);
      return '';
    })
    .join(' AND ');
}

/** What the snippet marks: the words actually searched for, after prefixes and corrections. */
export function highlighterFor(terms: ResolvedTerm[]): Highlighter {
  const exact = new Set<string>();
  const prefixes: string[] = [];
  for (const t of terms) {
    if (t.match === 'exact') exact.add(t.term);
    else if (t.match === 'prefix') {
      if (t.expand) t.expand.forEach((e) => exact.add(e));
      else prefixes.push(t.term);
    } else if (t.match === 'corrected') t.to.forEach((e) => exact.add(e));
  }
  return { exact, prefixes };
}
