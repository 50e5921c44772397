import { describe, it, expect } from 'vitest';
import type { JSONContent } from '@tiptap/core';
import { sectionPrompt, templateFor, thinSections, withSectionSlots } from '../../src/lib/editor/templates';
import { acceptanceNeeds, actionForMove } from '../../src/lib/record-rules';

const h = (text: string): JSONContent => ({ type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text }] });
const p = (text?: string): JSONContent => ({
  type: 'paragraph',
  ...(text ? { content: [{ type: 'text', text }] } : {}),
});

describe('section prompts', () => {
  it('names the prompt after a section heading only', () => {
    expect(sectionPrompt({ type: 'heading', text: 'Consequences' })).toMatch(/easier or harder/);
    expect(sectionPrompt({ type: 'heading', text: 'Notes from the pit' })).toBeNull();
    expect(sectionPrompt({ type: 'paragraph', text: 'Consequences' })).toBeNull();
    expect(sectionPrompt(null)).toBeNull();
  });

  it('gives each empty section a paragraph to show its prompt in, and leaves written ones alone', () => {
    const doc = { type: 'doc', content: [h('Context'), p('Written.'), h('Decision'), h('Consequences')] };
    expect(withSectionSlots(doc).content).toEqual([
      h('Context'),
      p('Written.'),
      h('Decision'),
      p(),
      h('Consequences'),
      p(),
    ]);
    // Already slotted: unchanged.
    expect(withSectionSlots(templateFor('lesson'))).toEqual(templateFor('lesson'));
  });
});

describe('a thin decision', () => {
  it('lists options and consequences when missing or empty, counting a leftover prompt as empty', () => {
    expect(thinSections('decision', templateFor('decision'))).toEqual(['Options considered', 'Consequences']);
    const written = {
      type: 'doc',
      content: [
        h('Options considered'),
        { type: 'bulletList', content: [{ type: 'listItem', content: [p('Two props')] }] },
        h('Consequences'),
        p('What this makes easier or harder; what to watch; when to revisit it.'),
      ],
    };
    expect(thinSections('decision', written)).toEqual(['Consequences']);
    expect(thinSections('decision', { type: 'doc', content: [p('Seventeen words and nothing else.')] })).toEqual([
      'Options considered',
      'Consequences',
    ]);
    expect(thinSections('lesson', templateFor('lesson'))).toEqual([]);
  });
});

describe('what acceptance still needs', () => {
  it('says so per status, only for decisions', () => {
    expect(acceptanceNeeds({ kind: 'decision', status: 'draft', reviewedCurrent: false })).toMatch(/Still a draft/);
    expect(acceptanceNeeds({ kind: 'decision', status: 'proposed', reviewedCurrent: false })).toMatch(
      /^Waiting for a review/,
    );
    expect(acceptanceNeeds({ kind: 'decision', status: 'proposed', reviewedCurrent: true })).toMatch(
      /ready to be accepted/,
    );
    expect(acceptanceNeeds({ kind: 'decision', status: 'accepted', reviewedCurrent: false })).toBeNull();
    expect(acceptanceNeeds({ kind: 'lesson', status: 'open', reviewedCurrent: false })).toBeNull();
  });

  it('maps each move to the permission it asks for', () => {
    expect(['accepted', 'withdrawn', 'proposed', 'superseded', 'addressed'].map(actionForMove)).toEqual([
      'record:accept',
      'record:withdraw',
      'record:status',
      'record:status',
      'record:status',
    ]);
  });
});
