// Snippets and highlighted titles, made here rather than by FTS5's snippet(): FTS5 re-runs the whole query for
// every row it quotes (1–50 ms for ten rows of a 50,000-document index, see the decision record), while the ten
// hits' text is a rowid lookup away. Words are matched with the same folding as the index (./tokens). The output is
// HTML: every piece of stored text is escaped, and only our own <mark> elements are added.
import { foldCase } from './tokens';

export interface Highlighter {
  /** Folded terms matched whole. */
  exact: Set<string>;
  /** Folded prefixes: any word starting with one matches. */
  prefixes: string[];
}

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

// C0 controls and DEL carry no meaning in a snippet; whitespace runs (newlines from the editor) read as one space.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g;
const clean = (s: string) => s.replace(CONTROL, '').replace(/\s+/g, ' ');

// A word is what FTS5 keeps together: it starts with a letter, digit or private-use character and goes on through
// those and combining marks, so "naïve" is one word.
const LETTER_LIKE = /[\p{L}\p{N}\p{Co}]/u;
const MARK = /\p{M}/u;

/** ASCII letters and digits, by character code. */
const asciiWordChar = (c: number) => (c >= 97 && c <= 122) || (c >= 48 && c <= 57) || (c >= 65 && c <= 90);

/**
 * The words of a text as parallel arrays (a long guide has thousands; an object each was most of a search's cost):
 * where each starts and ends, and the query term it matched (or null). `hitAt` lists the indexes that matched.
 */
interface Words {
  starts: number[];
  ends: number[];
  hits: (string | null)[];
  hitAt: number[];
}

/** The query term a folded word matches, or null. */
function matchOf(w: string, h: Highlighter): string | null {
  if (h.exact.has(w)) return w;
  for (const p of h.prefixes) if (w.startsWith(p)) return p;
  return null;
}

/** The first character codes any query term can start with: a plain word starting otherwise cannot match. */
function firstCodes(h: Highlighter): Set<number> {
  const out = new Set<number>();
  for (const t of h.exact) out.add(t.charCodeAt(0));
  for (const p of h.prefixes) out.add(p.charCodeAt(0));
  return out;
}

function words(text: string, h: Highlighter): Words {
  const out: Words = { starts: [], ends: [], hits: [], hitAt: [] };
  // The text is lower-cased once rather than word by word. Lower-casing never shortens a string, so when the length
  // is kept every offset is too, and a plain-ASCII word needs nothing more; otherwise (and for words with other
  // letters) each word is folded on its own, as the index folds it.
  const lower = text.toLowerCase();
  const sameOffsets = lower.length === text.length;
  const s = sameOffsets ? lower : text;
  const firsts = firstCodes(h);
  const n = s.length;
  let i = 0;
  while (i < n) {
    let c = s.charCodeAt(i);
    let step = 1;
    if (c >= 128) {
      const cp = s.codePointAt(i)!;
      step = cp > 0xffff ? 2 : 1;
      if (!LETTER_LIKE.test(String.fromCodePoint(cp))) {
        i += step;
        continue;
      }
    } else if (!asciiWordChar(c)) {
      i++;
      continue;
    }
    const start = i;
    let plain = c < 128;
    i += step;
    while (i < n) {
      c = s.charCodeAt(i);
      if (c < 128) {
        if (!asciiWordChar(c)) break;
        i++;
        continue;
      }
      const cp = s.codePointAt(i)!;
      const ch = String.fromCodePoint(cp);
      if (!LETTER_LIKE.test(ch) && !MARK.test(ch)) break;
      plain = false;
      i += cp > 0xffff ? 2 : 1;
    }
    let hit: string | null = null;
    if (sameOffsets && plain) {
      if (firsts.has(s.charCodeAt(start))) hit = matchOf(s.slice(start, i), h);
    } else hit = matchOf(foldCase(s.slice(start, i)), h);
    if (hit) out.hitAt.push(out.hits.length);
    out.starts.push(start);
    out.ends.push(i);
    out.hits.push(hit);
  }
  return out;
}

function render(text: string, list: Words, from: number, to: number): string {
  let html = '';
  let at = from;
  for (const k of list.hitAt) {
    const start = list.starts[k];
    const end = list.ends[k];
    if (end <= from || start >= to) continue;
    html += escapeHtml(clean(text.slice(at, start))) + '<mark>' + escapeHtml(clean(text.slice(start, end))) + '</mark>';
    at = end;
  }
  return html + escapeHtml(clean(text.slice(at, to)));
}

/** The whole text, escaped, with matched words in <mark>. */
export function highlightHtml(text: string, h: Highlighter): string {
  return render(text, words(text, h), 0, text.length).trim();
}

/**
 * The passage of `size` words that holds the most different query terms (then the most matches, then the earliest),
 * escaped, with matched words in <mark> and an ellipsis where text was cut.
 */
export function snippetHtml(text: string, h: Highlighter, size = 24): string {
  const list = words(text, h);
  const count = list.hits.length;
  if (count === 0) return '';
  let best = 0;
  let bestDistinct = -1;
  let bestHits = -1;
  const counts = new Map<string, number>();
  let hits = 0;
  for (let end = 0; end < count; end++) {
    const add = list.hits[end];
    if (add) {
      counts.set(add, (counts.get(add) ?? 0) + 1);
      hits++;
    }
    const start = end - size + 1;
    if (start > 0) {
      const drop = list.hits[start - 1];
      if (drop) {
        const n = counts.get(drop)! - 1;
        if (n === 0) counts.delete(drop);
        else counts.set(drop, n);
        hits--;
      }
    }
    if (start >= 0 || end === count - 1) {
      if (counts.size > bestDistinct || (counts.size === bestDistinct && hits > bestHits)) {
        best = Math.max(0, start);
        bestDistinct = counts.size;
        bestHits = hits;
      }
    }
  }
  // Centre the matches inside the passage rather than leaving them at its edge.
  const inWindow = list.hitAt.filter((k) => k >= best && k < best + size);
  if (inWindow.length > 0 && count > size) {
    const lo = inWindow[0];
    const hi = inWindow[inWindow.length - 1];
    best = Math.max(0, Math.min(lo - Math.floor((size - (hi - lo + 1)) / 2), count - size));
  }
  const lastIndex = Math.min(count, best + size) - 1;
  const from = best === 0 ? 0 : list.starts[best];
  const to = lastIndex === count - 1 ? text.length : list.ends[lastIndex];
  const html = render(text, list, from, to).trim();
  return (from > 0 ? '…' : '') + html + (to < text.length ? '…' : '');
}
