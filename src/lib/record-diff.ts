// What changed between two versions of a record's text, word by word, for the history page and the conflict view.
// Both documents are flattened into text blocks (paragraphs, headings, list items, code) carrying their inline
// marks; blocks are aligned with jsdiff's Myers diff (`diff`), and a changed block is compared word by word, so an
// insertion or deletion is marked inside the sentence it belongs to. A word whose text stayed but whose marks
// changed (made bold, link target changed) is a change of its own. Pure: no DOM, no server code.
import { diffArrays } from 'diff';

export interface Mark {
  type: string;
  attrs?: Record<string, unknown>;
}

export interface Run {
  text: string;
  marks: Mark[];
}

export interface Block {
  kind: 'heading' | 'paragraph' | 'code' | 'rule';
  /** Heading level (2, 3). */
  level?: number;
  /** The list the block sits in, innermost last: bullets, numbers or a task list (with the box's state). */
  lists: { type: 'bullet' | 'ordered' | 'task'; checked?: boolean; number?: number }[];
  quote: boolean;
  runs: Run[];
}

export type PieceOp = 'same' | 'ins' | 'del';

export interface Piece {
  text: string;
  marks: Mark[];
  op: PieceOp;
  /** The text is unchanged but its marks changed: what they were and are, in words. */
  markChange?: { before: string[]; after: string[] };
  /** With markChange: the marks the older text had. */
  oldMarks?: Mark[];
}

export type BlockOp = 'same' | 'changed' | 'added' | 'removed';

export interface BlockChange {
  op: BlockOp;
  /** The block as it is in the newer text (the older one for a removed block): its shape for rendering. */
  block: Block;
  /** How the block looked before, when its shape (heading level, list, quote) changed. */
  shapeChange?: { before: string; after: string };
  pieces: Piece[];
}

export interface DocDiff {
  blocks: BlockChange[];
  stats: { insertedWords: number; deletedWords: number; markChanges: number; changedBlocks: number };
}

interface JsonNode {
  type?: string;
  text?: string;
  attrs?: Record<string, unknown>;
  marks?: Mark[];
  content?: JsonNode[];
}

const isNode = (v: unknown): v is JsonNode => typeof v === 'object' && v !== null && !Array.isArray(v);

function inlineRuns(node: JsonNode): Run[] {
  const out: Run[] = [];
  for (const child of node.content ?? []) {
    if (!isNode(child)) continue;
    if (child.type === 'text' && typeof child.text === 'string')
      out.push({ text: child.text, marks: (child.marks ?? []).map((m) => ({ type: m.type, attrs: m.attrs })) });
    else if (child.type === 'hardBreak') out.push({ text: '\n', marks: [] });
  }
  return out;
}

/** The document's text blocks in reading order, whatever nesting of lists and quotes holds them. */
export function blocksOf(doc: unknown): Block[] {
  const out: Block[] = [];
  const walk = (node: JsonNode, lists: Block['lists'], quote: boolean) => {
    for (const child of node.content ?? []) {
      if (!isNode(child)) continue;
      switch (child.type) {
        case 'paragraph':
          out.push({ kind: 'paragraph', lists, quote, runs: inlineRuns(child) });
          break;
        case 'heading':
          out.push({ kind: 'heading', level: Number(child.attrs?.level ?? 2), lists, quote, runs: inlineRuns(child) });
          break;
        case 'codeBlock':
          out.push({ kind: 'code', lists, quote, runs: inlineRuns(child) });
          break;
        case 'horizontalRule':
          out.push({ kind: 'rule', lists, quote, runs: [] });
          break;
        case 'image': {
          // A picture compares by its description, so adding, removing or describing one shows as a change.
          const alt = typeof child.attrs?.alt === 'string' && child.attrs.alt ? child.attrs.alt : 'no description';
          out.push({ kind: 'paragraph', lists, quote, runs: [{ text: `[Image: ${alt}]`, marks: [] }] });
          break;
        }
        case 'bulletList':
        case 'orderedList':
        case 'taskList':
          walk(child, lists, quote);
          break;
        case 'listItem':
        case 'taskItem': {
          const type: Block['lists'][number]['type'] =
            child.type === 'taskItem' ? 'task' : node.type === 'orderedList' ? 'ordered' : 'bullet';
          const number = (node.content ?? []).indexOf(child) + Number(node.attrs?.start ?? 1);
          const item =
            type === 'task'
              ? { type, checked: child.attrs?.checked === true }
              : type === 'ordered'
                ? { type, number }
                : { type };
          walk(child, [...lists, item], quote);
          break;
        }
        case 'blockquote':
          walk(child, lists, true);
          break;
        default:
          if (child.content) walk(child, lists, quote);
      }
    }
  };
  if (isNode(doc)) walk(doc, [], false);
  return out;
}

export function blockText(b: Block): string {
  return b.runs.map((r) => r.text).join('');
}

function shapeOf(b: Block): string {
  const where = [
    ...b.lists.map((l) => (l.type === 'task' ? (l.checked ? 'ticked task' : 'open task') : `${l.type} list`)),
    ...(b.quote ? ['quote'] : []),
  ];
  const kind = b.kind === 'heading' ? `heading ${b.level}` : b.kind === 'code' ? 'code' : b.kind;
  return [kind, ...where].join(', ');
}

const markKey = (m: Mark) =>
  m.type === 'link' ? `link:${typeof m.attrs?.href === 'string' ? m.attrs.href : ''}` : m.type;
const marksKey = (marks: Mark[]) => marks.map(markKey).sort().join('|');

const MARK_WORDS: Record<string, string> = {
  bold: 'bold',
  italic: 'italic',
  strike: 'struck through',
  underline: 'underlined',
  code: 'code',
  link: 'link',
};
const markWord = (k: string) =>
  k.startsWith('link:')
    ? `link to ${k.slice(5)}`
    : (MARK_WORDS[k] ?? k.replace(/[A-Z]/g, (c) => ` ${c.toLowerCase()}`));

interface Token {
  text: string;
  marks: Mark[];
}

const TOKEN = /\s+|[\p{L}\p{N}\p{M}_'’.,:;%°/-]*[\p{L}\p{N}\p{M}]|[^\s]/gu;
const WORDISH = /[\p{L}\p{N}]/u;

/** Words, runs of white space and single other characters, each with the marks of the run it came from. */
export function tokensOf(runs: Run[]): Token[] {
  const out: Token[] = [];
  for (const r of runs) for (const m of r.text.matchAll(TOKEN)) out.push({ text: m[0], marks: r.marks });
  return out;
}

function push(pieces: Piece[], p: Piece) {
  const last = pieces[pieces.length - 1];
  if (last && last.op === p.op && !last.markChange && !p.markChange && marksKey(last.marks) === marksKey(p.marks))
    last.text += p.text;
  else pieces.push({ ...p });
}

/** Two runs of text compared word by word: unchanged, inserted and deleted pieces, and changes of marks. */
export function diffRuns(
  before: Run[],
  after: Run[],
): { pieces: Piece[]; inserted: number; deleted: number; marks: number } {
  const a = tokensOf(before);
  const b = tokensOf(after);
  const pieces: Piece[] = [];
  let inserted = 0;
  let deleted = 0;
  let marks = 0;
  let i = 0; // position in a
  let j = 0; // position in b
  for (const part of diffArrays(a, b, { comparator: (x, y) => x.text === y.text })) {
    const n = part.value.length;
    if (part.added || part.removed) {
      const op: PieceOp = part.added ? 'ins' : 'del';
      for (const t of part.added ? b.slice(j, j + n) : a.slice(i, i + n)) {
        if (WORDISH.test(t.text)) {
          if (op === 'ins') inserted++;
          else deleted++;
        }
        push(pieces, { text: t.text, marks: t.marks, op });
      }
      if (part.added) j += n;
      else i += n;
      continue;
    }
    // Equal text: were the marks kept?
    for (let k = 0; k < n; k++) {
      const older = a[i + k];
      const newer = b[j + k];
      const was = marksKey(older.marks);
      const now = marksKey(newer.marks);
      if (was === now || !WORDISH.test(newer.text)) {
        push(pieces, { text: newer.text, marks: newer.marks, op: 'same' });
        continue;
      }
      const beforeKeys = was ? was.split('|') : [];
      const afterKeys = now ? now.split('|') : [];
      const change = {
        before: beforeKeys.filter((x) => !afterKeys.includes(x)).map(markWord),
        after: afterKeys.filter((x) => !beforeKeys.includes(x)).map(markWord),
      };
      // Words with the same change of marks, separated only by spaces, are one change (a phrase made bold).
      const last = pieces[pieces.length - 1];
      const gap = last && !last.markChange && last.op === 'same' && /^\s+$/.test(last.text) ? last : null;
      const prev = gap ? pieces[pieces.length - 2] : last;
      if (prev?.markChange && JSON.stringify(prev.markChange) === JSON.stringify(change)) {
        if (gap) pieces.pop();
        prev.text += (gap?.text ?? '') + newer.text;
      } else {
        marks++;
        pieces.push({ text: newer.text, marks: newer.marks, op: 'same', markChange: change, oldMarks: older.marks });
      }
    }
    i += n;
    j += n;
  }
  return { pieces: tidy(pieces), inserted, deleted, marks };
}

/**
 * A lone space kept between two changes makes “one propeller → two propellers” read as two changes; folding such
 * spaces into the changes around them and putting a group's deletions before its insertions reads as one.
 */
function tidy(pieces: Piece[]): Piece[] {
  const out: Piece[] = [];
  let group: Piece[] = [];
  const flush = () => {
    for (const op of ['del', 'ins'] as const) for (const g of group) if (g.op === op) push(out, g);
    group = [];
  };
  pieces.forEach((piece, k) => {
    const changed = piece.op !== 'same';
    const space =
      piece.op === 'same' &&
      !piece.markChange &&
      /^\s+$/.test(piece.text) &&
      group.length > 0 &&
      pieces[k + 1] !== undefined &&
      pieces[k + 1].op !== 'same';
    if (changed) group.push(piece);
    else if (space) {
      group.push({ ...piece, op: 'del' }, { ...piece, op: 'ins' });
    } else {
      flush();
      out.push(piece);
    }
  });
  flush();
  return out;
}

function similarity(a: Block, b: Block): number {
  const words = (x: Block) =>
    new Set(
      blockText(x)
        .toLowerCase()
        .match(/[\p{L}\p{N}]+/gu) ?? [],
    );
  const wa = words(a);
  const wb = words(b);
  if (wa.size === 0 && wb.size === 0) return 1;
  let shared = 0;
  for (const w of wa) if (wb.has(w)) shared++;
  return shared / Math.max(wa.size, wb.size);
}

function compareBlocks(before: Block, after: Block, stats: DocDiff['stats']): BlockChange {
  const d = diffRuns(before.runs, after.runs);
  stats.insertedWords += d.inserted;
  stats.deletedWords += d.deleted;
  stats.markChanges += d.marks;
  const shapeBefore = shapeOf(before);
  const shapeAfter = shapeOf(after);
  const changed = shapeBefore !== shapeAfter || d.pieces.some((p) => p.op !== 'same' || p.markChange);
  if (changed) stats.changedBlocks++;
  return {
    op: changed ? 'changed' : 'same',
    block: after,
    ...(shapeBefore !== shapeAfter ? { shapeChange: { before: shapeBefore, after: shapeAfter } } : {}),
    pieces: d.pieces,
  };
}

function whole(b: Block, op: 'ins' | 'del', stats: DocDiff['stats']): BlockChange {
  const words = tokensOf(b.runs).filter((t) => WORDISH.test(t.text)).length;
  if (op === 'ins') stats.insertedWords += words;
  else stats.deletedWords += words;
  stats.changedBlocks++;
  return { op: op === 'ins' ? 'added' : 'removed', block: b, pieces: b.runs.map((r) => ({ ...r, op })) };
}

/** The difference between two editor documents (older first), block by block and word by word. */
export function diffDocs(older: unknown, newer: unknown): DocDiff {
  const a = blocksOf(older);
  const b = blocksOf(newer);
  const stats = { insertedWords: 0, deletedWords: 0, markChanges: 0, changedBlocks: 0 };
  const blocks: BlockChange[] = [];
  const key = (x: Block) => `${x.kind}\u0000${blockText(x)}`;
  const parts = diffArrays(a, b, { comparator: (x, y) => key(x) === key(y) });
  let i = 0; // position in a
  let j0 = 0; // position in b
  for (let p = 0; p < parts.length; p++) {
    const part = parts[p];
    const n = part.value.length;
    if (!part.added && !part.removed) {
      // Same text; compare anyway for changes of marks or of the block's place (a paragraph moved into a list).
      for (let k = 0; k < n; k++) blocks.push(compareBlocks(a[i + k], b[j0 + k], stats));
      i += n;
      j0 += n;
      continue;
    }
    // A run of removed blocks followed by added ones: pair the ones that are edits of each other.
    let removed: Block[] = [];
    let added: Block[] = [];
    if (part.removed) {
      removed = a.slice(i, i + n);
      i += n;
      if (parts[p + 1]?.added) {
        const m = parts[++p].value.length;
        added = b.slice(j0, j0 + m);
        j0 += m;
      }
    } else {
      added = b.slice(j0, j0 + n);
      j0 += n;
    }
    // One block replaced by one block of the same kind is an edit of it, however much it changed.
    const oneForOne = removed.length === 1 && added.length === 1 && removed[0].kind === added[0].kind;
    let j = 0;
    for (const old of removed) {
      const match = oneForOne ? 0 : added.findIndex((n, k) => k >= j && similarity(old, n) >= 0.3);
      if (match === -1) {
        blocks.push(whole(old, 'del', stats));
        continue;
      }
      for (; j < match; j++) blocks.push(whole(added[j], 'ins', stats));
      blocks.push(compareBlocks(old, added[match], stats));
      j = match + 1;
    }
    for (; j < added.length; j++) blocks.push(whole(added[j], 'ins', stats));
  }
  return { blocks, stats };
}

/** The title's change, word by word (titles have no marks). */
export function diffTitles(older: string, newer: string): Piece[] {
  return diffRuns([{ text: older, marks: [] }], [{ text: newer, marks: [] }]).pieces;
}
