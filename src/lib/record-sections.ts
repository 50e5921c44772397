// A record's text cut into its sections (a heading and what follows it), for the conflict view: which sections two
// texts disagree on, and a merged text built from a choice per section. Pure.
import { diffArrays } from 'diff';
import { blockText, blocksOf } from './record-diff';

export interface DocNode {
  type: string;
  attrs?: Record<string, unknown>;
  content?: DocNode[];
  marks?: { type: string; attrs?: Record<string, unknown> }[];
  text?: string;
}

export interface Section {
  /** The heading's text, or '' for what comes before the first heading. */
  title: string;
  /** The heading node itself (null for the opening part) followed by the section's content. */
  nodes: DocNode[];
}

export type SectionChoice = 'mine' | 'theirs' | 'both';

export interface SectionPair {
  key: string;
  title: string;
  mine: Section | null;
  theirs: Section | null;
  same: boolean;
}

const isHeading = (n: DocNode) => n.type === 'heading' && Number(n.attrs?.level ?? 2) <= 2;
const headingText = (n: DocNode) =>
  blocksOf({ type: 'doc', content: [n] })
    .map(blockText)
    .join(' ')
    .trim();

/** Cuts a document at its top-level section headings (level 2, as in the record templates). */
export function splitSections(doc: { content?: DocNode[] } | null | undefined): Section[] {
  const out: Section[] = [];
  for (const node of doc?.content ?? []) {
    if (isHeading(node)) out.push({ title: headingText(node), nodes: [node] });
    else if (out.length === 0) out.push({ title: '', nodes: [node] });
    else out[out.length - 1].nodes.push(node);
  }
  return out;
}

const norm = (t: string) => t.trim().toLowerCase().replace(/\s+/g, ' ');
const same = (a: Section | null, b: Section | null) =>
  !!a && !!b && JSON.stringify(a.nodes) === JSON.stringify(b.nodes);

/**
 * Pairs the sections of two texts by their headings, in my order, with sections only they have placed after the
 * section that precedes them in their text.
 */
export function pairSections(mine: Section[], theirs: Section[]): SectionPair[] {
  const used = new Set<number>();
  const pairs: SectionPair[] = mine.map((m, i) => {
    const t = theirs.findIndex((x, k) => !used.has(k) && norm(x.title) === norm(m.title));
    if (t !== -1) used.add(t);
    const other = t === -1 ? null : theirs[t];
    return { key: `s${i}`, title: m.title, mine: m, theirs: other, same: same(m, other) };
  });
  theirs.forEach((t, k) => {
    if (used.has(k)) return;
    // After the pair holding their previous section, or at the start.
    const prevTitle = k > 0 ? norm(theirs[k - 1].title) : null;
    const at = prevTitle === null ? -1 : pairs.findIndex((p) => p.theirs && norm(p.theirs.title) === prevTitle);
    pairs.splice(at + 1, 0, { key: `t${k}`, title: t.title, mine: null, theirs: t, same: false });
  });
  return pairs;
}

/**
 * Both texts of one section together: blocks they share once, blocks only one has kept in the order they come,
 * so nothing either person wrote is dropped.
 */
export function mergeNodes(mine: DocNode[], theirs: DocNode[]): DocNode[] {
  const out: DocNode[] = [];
  let i = 0;
  let j = 0;
  const key = (n: DocNode) => JSON.stringify(n);
  for (const part of diffArrays(mine.map(key), theirs.map(key))) {
    const n = part.value.length;
    if (part.added) {
      out.push(...theirs.slice(j, j + n));
      j += n;
    } else if (part.removed) {
      out.push(...mine.slice(i, i + n));
      i += n;
    } else {
      out.push(...mine.slice(i, i + n));
      i += n;
      j += n;
    }
  }
  return out;
}

/** The merged document: for each pair, my section, theirs, or both merged (the default for unchosen ones: mine). */
export function mergeSections(
  pairs: SectionPair[],
  choices: Record<string, SectionChoice>,
): { type: 'doc'; content: DocNode[] } {
  const content: DocNode[] = [];
  for (const p of pairs) {
    const choice = choices[p.key] ?? (p.mine ? 'mine' : 'theirs');
    const mine = p.mine?.nodes ?? [];
    const theirs = p.theirs?.nodes ?? [];
    if (choice === 'mine') content.push(...mine);
    else if (choice === 'theirs') content.push(...theirs);
    else content.push(...mergeNodes(mine, theirs));
  }
  return { type: 'doc', content: content.length ? content : [{ type: 'paragraph' }] };
}

/** Sections that differ first (in text order), then the ones both texts agree on. */
export function differingFirst(pairs: SectionPair[]): SectionPair[] {
  return [...pairs.filter((p) => !p.same), ...pairs.filter((p) => p.same)];
}
