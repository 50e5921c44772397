import { describe, it, expect } from 'vitest';
import { canMove, nextStatuses, needsReplacement, isValidStatus, INITIAL_STATUS } from '../../src/lib/record-rules';

// API.md: decision statuses draft → proposed → accepted → superseded | withdrawn (proposed may also go to
// withdrawn); lesson statuses open → addressed.
const ALLOWED = new Set([
  'decision:draft>proposed',
  'decision:proposed>accepted',
  'decision:proposed>withdrawn',
  'decision:accepted>superseded',
  'decision:accepted>withdrawn',
  'lesson:open>addressed',
]);
const ALL: Record<'decision' | 'lesson', string[]> = {
  decision: ['draft', 'proposed', 'accepted', 'superseded', 'withdrawn'],
  lesson: ['open', 'addressed'],
};

describe('record lifecycles', () => {
  for (const kind of ['decision', 'lesson'] as const) {
    for (const from of ALL[kind]) {
      for (const to of [...ALL.decision, ...ALL.lesson]) {
        const allowed = ALLOWED.has(`${kind}:${from}>${to}`);
        it(`${kind}: ${from} → ${to} is ${allowed ? 'allowed' : 'refused'}`, () => {
          expect(canMove(kind, from, to)).toBe(allowed);
        });
      }
    }
  }
  it('starts decisions as drafts and lessons as open', () => {
    expect(INITIAL_STATUS).toEqual({ decision: 'draft', lesson: 'open' });
  });
  it('only superseding needs a replacement; unknown statuses are invalid', () => {
    expect(needsReplacement('superseded')).toBe(true);
    expect(needsReplacement('withdrawn')).toBe(false);
    expect(isValidStatus('lesson', 'accepted')).toBe(false);
    expect(nextStatuses('decision', 'nonsense')).toEqual([]);
  });
});
