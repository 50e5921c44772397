// Snippets and highlighted titles, made here rather than by FTS5's snippet(): FTS5 re-runs the whole query for
// every row it quotes (1–50 ms for ten rows of a 50,000-document index, see the decision record), while the ten
// hits' text is a rowid lookup away. Words are matched with the same folding as the index (./tokens). The output is
// HTML: every piece of stored text is escaped, and only our own <mark> elements are added.
import { foldCase, isAscii } from './tokens';

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

// Marks stay in a word so "naïve" is one word, as FTS5 sees it.
const WORD = /[\p{L}\p{N}\p{Co}][\p{L}\p{N}\p{Co}\p{M}]*/gu;
// The same words in lower-cased plain ASCII text (no marks or private-use characters there).
const ASCII_WORD = /[a-z0-9]+/g;

const NON_ASCII = /[^\u0000-\u007f]/;

interface Word {
  start: number;
  end: number;
  /** The query term this word matched, or null. */
  hit: string | null;
}

/** The query term a folded word matches, or null. */
function matchOf(w: string, h: Highlighter): string | null {
  if (h.exact.has(w)) return w;
  for (const p of h.prefixes) if (w.startsWith(p)) return p;
  return null;
}

function words(text: string, h: Highlighter): Word[] {
  const out: Word[] = [];
  // The text is lower-cased once rather than word by word. Lower-casing never shortens a string, so when the length
  // is kept every offset is too (else each word is folded on its own); only words with non-ASCII letters still need
  // their marks removed.
  const lower = text.toLowerCase();
  const sameOffsets = lower.length === text.length;
  if (sameOffsets && isAscii(text)) {
    for (const m of lower.matchAll(ASCII_WORD))
      out.push({ start: m.index, end: m.index + m[0].length, hit: matchOf(m[0], h) });
    return out;
  }
  for (const m of (sameOffsets ? lower : text).matchAll(WORD)) {
    const w = sameOffsets && !NON_ASCII.test(m[0]) ? m[0] : foldCase(m[0]);
    out.push({ start: m.index, end: m.index + m[0].length, hit: matchOf(w, h) });
  }
  return out;
}

function render(text: string, list: Word[], from: number, to: number): string {
  let html = '';
  let at = from;
  for (const w of list) {
    if (!w.hit || w.end <= from || w.start >= to) continue;
    html +=
      escapeHtml(clean(text.slice(at, w.start))) + '<mark>' + escapeHtml(clean(text.slice(w.start, w.end))) + '</mark>';
    at = w.end;
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
  if (list.length === 0) return '';
  let best = 0;
  let bestDistinct = -1;
  let bestHits = -1;
  const counts = new Map<string, number>();
  let hits = 0;
  for (let end = 0; end < list.length; end++) {
    const add = list[end].hit;
    if (add) {
      counts.set(add, (counts.get(add) ?? 0) + 1);
      hits++;
    }
    const start = end - size + 1;
    if (start > 0) {
      const drop = list[start - 1].hit;
      if (drop) {
        const n = counts.get(drop)! - 1;
        if (n === 0) counts.delete(drop);
        else counts.set(drop, n);
        hits--;
      }
    }
    if (start >= 0 || end === list.length - 1) {
      if (counts.size > bestDistinct || (counts.size === bestDistinct && hits > bestHits)) {
        best = Math.max(0, start);
        bestDistinct = counts.size;
        bestHits = hits;
      }
    }
  }
  // Centre the matches inside the passage rather than leaving them at its edge.
  const inWindow = list.slice(best, best + size).flatMap((w, k) => (w.hit ? [best + k] : []));
  if (inWindow.length > 0 && list.length > size) {
    const lo = inWindow[0];
    const hi = inWindow[inWindow.length - 1];
    best = Math.max(0, Math.min(lo - Math.floor((size - (hi - lo + 1)) / 2), list.length - size));
  }
  const first = list[best];
  const last = list[Math.min(list.length, best + size) - 1];
  const from = best === 0 ? 0 : first.start;
  const to = last === list[list.length - 1] ? text.length : last.end;
  const html = render(text, list, from, to).trim();
  return (from > 0 ? '…' : '') + html + (to < text.length ? '…' : '');
}
