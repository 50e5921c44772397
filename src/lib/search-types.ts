// What search answers, and its kinds: no zod here, so the header's search island (on every page) stays small.
// The query schema is in schemas/search.ts.

export const SEARCH_TYPES = ['guide', 'decision', 'lesson', 'calculation'] as const;
export type SearchType = (typeof SEARCH_TYPES)[number];

export const SEARCH_TYPE_LABELS: Record<SearchType, string> = {
  guide: 'Guides',
  decision: 'Decision records',
  lesson: 'Lessons',
  calculation: 'Calculations',
};

export interface SearchHit {
  type: SearchType;
  id: string;
  title: string;
  /** The title, HTML-escaped, with matched words in <mark>. */
  titleHtml: string;
  /** A passage of the text, HTML-escaped, with matched words in <mark>: safe to insert as HTML. */
  snippet: string;
  subsystem: string;
  subsystemName: string | null;
  season: string | null;
  seasonId: string | null;
  status: string | null;
  kind: string | null;
  url: string;
  /** Every word is in the title (these come first). */
  titleMatch: boolean;
  /** BM25 relevance, higher is better; compare only within one answer. */
  score: number;
}

export interface SearchResponse {
  hits: SearchHit[];
  /** Matching documents; when `totalCapped`, at least this many. */
  total: number;
  totalCapped: boolean;
  /** Words that matched nothing and were searched as the nearest words of the index instead. */
  corrections: { from: string; to: string[] }[];
  /** Words that matched nothing, even after correction (then there are no hits). */
  unmatched: string[];
  tookMs: number;
}
