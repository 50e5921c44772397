import type { JSONContent } from '@tiptap/core';
import type { RecordKind } from '../domain';

export const DECISION_SECTIONS = ['Context', 'Options considered', 'Decision', 'Consequences'] as const;
export const LESSON_SECTIONS = ['What happened', 'Impact', 'Root cause', 'Recommendation for the next cohort'] as const;

const HINTS: Record<string, string> = {
  Context: 'What problem were you solving, with which constraints (rules, budget, time, last season’s boat)?',
  'Options considered': 'Each option you looked at, with its pros and cons and the numbers behind them.',
  Decision: 'What you chose, and the deciding reason.',
  Consequences: 'What this makes easier or harder; what to watch; when to revisit it.',
  'What happened': 'The facts, in order: when, where, what you saw.',
  Impact: 'What it cost: time, points, parts, safety margin.',
  'Root cause': 'Why it happened, as far as you could tell, and how you know.',
  'Recommendation for the next cohort': 'What the next team should do differently, concretely.',
};

/** A new record opens with its kind's sections as headings, each with a one-line prompt to replace. */
export function templateFor(kind: RecordKind): JSONContent {
  const sections = kind === 'decision' ? DECISION_SECTIONS : LESSON_SECTIONS;
  return {
    type: 'doc',
    content: sections.flatMap((title) => [
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: title }] },
      { type: 'paragraph', content: [{ type: 'text', marks: [{ type: 'italic' }], text: HINTS[title] }] },
    ]),
  };
}
