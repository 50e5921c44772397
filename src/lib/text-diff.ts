// Line-level difference of two texts, by jsdiff (`diff`): Myers' algorithm, so time and memory grow with the size of
// the change, not with the product of the two lengths. Pure.
import { diffLines as diffChanges } from 'diff';

export type DiffLine = { kind: 'same' | 'added' | 'removed'; text: string };

export function diffLines(a: string, b: string): DiffLine[] {
  // Ending both texts with a line break makes the last line compare like every other one.
  const out: DiffLine[] = [];
  for (const change of diffChanges(`${a}\n`, `${b}\n`)) {
    const kind = change.added ? 'added' : change.removed ? 'removed' : 'same';
    const lines = change.value.split('\n');
    lines.pop(); // every value ends with a line break, so the last piece is empty
    for (const text of lines) out.push({ kind, text });
  }
  return out;
}
