// The term vocabulary of the search index in MiniSearch's radix tree (SearchableMap): exact and prefix look-ups in
// microseconds and fuzzy look-ups (edit distance) for typo correction. It holds terms only, never documents, so it
// stays small; FTS5 holds the documents. Values are document frequencies, used to prefer common corrections.
import SearchableMap from 'minisearch/SearchableMap';

const HAS_DIGIT = /\p{N}/u;

/** Edits allowed when correcting a term: none for short words (too many neighbours), one or two for longer ones. */
export function maxEditsFor(term: string): number {
  if (term.length < 4 || HAS_DIGIT.test(term)) return 0;
  return term.length <= 5 ? 1 : 2;
}

export class Vocabulary {
  private readonly terms = new SearchableMap<number>();

  entries(): IterableIterator<[string, number]> {
    return this.terms.entries();
  }

  get size(): number {
    return this.terms.size;
  }

  has(term: string): boolean {
    return this.terms.has(term);
  }

  /** Some term starts with `prefix` (the term itself counts). */
  hasPrefix(prefix: string): boolean {
    return !this.terms.atPrefix(prefix).keys().next().done;
  }

  /** Adds a term seen in `docs` documents; a term already known keeps the larger count. */
  add(term: string, docs = 1): void {
    const known = this.terms.get(term);
    if (known === undefined || known < docs) this.terms.set(term, docs);
  }

  /** Adds unknown terms; returns the ones that were new. */
  addAll(terms: Iterable<string>): string[] {
    const added: string[] = [];
    for (const t of terms) {
      if (this.terms.has(t)) continue;
      this.terms.set(t, 1);
      added.push(t);
    }
    return added;
  }

  /**
   * The nearest known terms to a term that is not known: the fewest edits wins, then the most common. An edit is
   * a letter added, dropped, replaced, or two neighbours swapped: the four slips Damerau (1964, "A technique for
   * computer detection and correction of spelling errors", CACM 7(3)) found behind most misspellings. The radix
   * tree's look-up counts a swap as two edits, so it is asked for two and the answers re-measured.
   * Returns at most `limit` terms, all at that smallest distance; none when nothing is near enough.
   */
  corrections(term: string, limit = 3): string[] {
    const edits = maxEditsFor(term);
    if (edits === 0) return [];
    const near: [string, number, number][] = [];
    for (const [t, [docs]] of this.terms.fuzzyGet(term, 2)) {
      const d = t === term ? 0 : editDistance(term, t);
      if (d > 0 && d <= edits) near.push([t, d, docs]);
    }
    if (near.length === 0) return [];
    const best = Math.min(...near.map(([, d]) => d));
    return near
      .filter(([, d]) => d === best)
      .sort((a, b) => b[2] - a[2] || a[0].localeCompare(b[0]))
      .slice(0, limit)
      .map(([t]) => t);
  }
}

/** Optimal string alignment distance: insertions, deletions, substitutions and adjacent transpositions. */
export function editDistance(a: string, b: string): number {
  const x = [...a];
  const y = [...b];
  let prev2: number[] = [];
  let prev = Array.from({ length: y.length + 1 }, (_, j) => j);
  for (let i = 1; i <= x.length; i++) {
    const row = [i];
    for (let j = 1; j <= y.length; j++) {
      const cost = x[i - 1] === y[j - 1] ? 0 : 1;
      let d = Math.min(prev[j] + 1, row[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && x[i - 1] === y[j - 2] && x[i - 2] === y[j - 1]) d = Math.min(d, prev2[j - 2] + 1);
      row.push(d);
    }
    prev2 = prev;
    prev = row;
  }
  return prev[y.length];
}
