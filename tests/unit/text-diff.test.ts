import { describe, it, expect } from 'vitest';
import { diffLines } from '../../src/lib/text-diff';

describe('diffLines', () => {
  it('marks added and removed lines and keeps the common ones in order', () => {
    expect(diffLines('a\nb\nc', 'a\nc\nd')).toEqual([
      { kind: 'same', text: 'a' },
      { kind: 'removed', text: 'b' },
      { kind: 'same', text: 'c' },
      { kind: 'added', text: 'd' },
    ]);
  });
  it('identical texts have no changes', () => {
    expect(diffLines('x\ny', 'x\ny').every((d) => d.kind === 'same')).toBe(true);
  });
});
