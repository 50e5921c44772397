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

describe('diffLines on records', () => {
  it('keeps blank lines, a changed last line and a text made empty', () => {
    expect(diffLines('Title\n\nold end', 'Title\n\nnew end')).toEqual([
      { kind: 'same', text: 'Title' },
      { kind: 'same', text: '' },
      { kind: 'removed', text: 'old end' },
      { kind: 'added', text: 'new end' },
    ]);
    expect(diffLines('x', '')).toEqual([
      { kind: 'removed', text: 'x' },
      { kind: 'added', text: '' },
    ]);
  });
  it('a one-line change in a long record is one removed and one added line', () => {
    const lines = Array.from({ length: 5000 }, (_, i) => `line ${i}`);
    const changed = [...lines];
    changed[2500] = 'line 2500, corrected';
    const d = diffLines(lines.join('\n'), changed.join('\n'));
    expect(d.filter((l) => l.kind !== 'same')).toEqual([
      { kind: 'removed', text: 'line 2500' },
      { kind: 'added', text: 'line 2500, corrected' },
    ]);
    expect(d).toHaveLength(5001);
  });
});
