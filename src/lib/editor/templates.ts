import type { JSONContent } from '@tiptap/core';
import type { RecordKind } from '../domain';

export const DECISION_SECTIONS = ['Context', 'Options considered', 'Decision', 'Consequences'] as const;
export const LESSON_SECTIONS = ['What happened', 'Impact', 'Root cause', 'Recommendation for the next cohort'] as const;

const PROMPTS: Record<string, string> = {
  Context: 'What problem were you solving, with which constraints (rules, budget, time, last season’s boat)?',
  'Options considered': 'Each option you looked at, with its pros and cons and the numbers behind them.',
  Decision: 'What you chose, and the deciding reason.',
  Consequences: 'What this makes easier or harder; what to watch; when to revisit it.',
  'What happened': 'The facts, in order: when, where, what you saw.',
  Impact: 'What it cost: time, points, parts, safety margin.',
  'Root cause': 'Why it happened, as far as you could tell, and how you know.',
  'Recommendation for the next cohort': 'What the next team should do differently, concretely.',
};

/** The section prompts, for the server to recognise one an older editor stored as text. */
export const SECTION_PROMPTS: readonly string[] = Object.values(PROMPTS);

const textOf = (n: JSONContent | undefined): string =>
  !n ? '' : typeof n.text === 'string' ? n.text : (n.content ?? []).map(textOf).join('');

/** The prompt for the block after `previous` when `previous` is a section heading; null after anything else. */
export function sectionPrompt(previous: { type: string; text: string } | null | undefined): string | null {
  if (previous?.type !== 'heading') return null;
  return PROMPTS[previous.text.trim()] ?? null;
}

const emptyParagraph = (): JSONContent => ({ type: 'paragraph' });

/**
 * A new record opens with its kind's sections as headings, each followed by an empty paragraph. The editor shows
 * each section's prompt there as a placeholder (never part of the document, so it is never saved).
 */
export function templateFor(kind: RecordKind): JSONContent {
  const sections = kind === 'decision' ? DECISION_SECTIONS : LESSON_SECTIONS;
  return {
    type: 'doc',
    content: sections.flatMap((title) => [
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: title }] },
      emptyParagraph(),
    ]),
  };
}

/**
 * Gives every section heading that has nothing under it (the next block is a heading, or the end) an empty
 * paragraph, so an emptied section shows its prompt again when the record is reopened in the editor.
 */
export function withSectionSlots(doc: JSONContent): JSONContent {
  const blocks = doc.content ?? [];
  const out: JSONContent[] = [];
  blocks.forEach((b, i) => {
    out.push(b);
    const next = blocks[i + 1];
    const isSection = sectionPrompt({ type: b.type ?? '', text: textOf(b) }) !== null;
    if (isSection && (!next || next.type === 'heading')) out.push(emptyParagraph());
  });
  return { ...doc, content: out };
}

/**
 * The sections a decision record cannot do without before it is put to the team: the options weighed and the
 * consequences. Listed when the heading is missing or nothing is written under it.
 */
const NEEDED: Record<RecordKind, readonly string[]> = {
  decision: ['Options considered', 'Consequences'],
  lesson: [],
};

export function thinSections(kind: RecordKind, doc: unknown): string[] {
  const blocks = (doc as JSONContent | null)?.content ?? [];
  const written = new Map<string, boolean>();
  let current: string | null = null;
  for (const b of blocks) {
    if (b.type === 'heading') {
      current = textOf(b).trim();
      if (!written.has(current)) written.set(current, false);
    } else if (current !== null && textOf(b).trim() !== '' && !SECTION_PROMPTS.includes(textOf(b).trim())) {
      written.set(current, true);
    }
  }
  return NEEDED[kind].filter((s) => written.get(s) !== true);
}
