import { describe, it, expect } from 'vitest';
import { Vocabulary, maxEditsFor, editDistance } from '../../../src/lib/server/search/vocabulary';

function vocab(entries: [string, number][]) {
  const v = new Vocabulary();
  for (const [t, d] of entries) v.add(t, d);
  return v;
}

describe('Vocabulary', () => {
  const v = vocab([
    ['propeller', 20],
    ['propellers', 5],
    ['propulsion', 9],
    ['ventilation', 7],
    ['vent', 1],
    ['seal', 12],
    ['sail', 3],
    ['shaft', 8],
  ]);

  it('knows words and prefixes', () => {
    expect(v.has('propeller')).toBe(true);
    expect(v.has('propel')).toBe(false);
    expect(v.hasPrefix('propel')).toBe(true);
    expect(v.hasPrefix('vent')).toBe(true);
    expect(v.hasPrefix('xyz')).toBe(false);
  });

  it('corrects a typo to the nearest word, the most common first', () => {
    expect(v.corrections('propeler')).toEqual(['propeller']);
    expect(v.corrections('ventilaton')).toEqual(['ventilation']);
    // "seil" is one edit from both "seal" and "sail": both are offered, the more common first.
    expect(v.corrections('seil')).toEqual(['seal', 'sail']);
    expect(v.corrections('qqqqqqqq')).toEqual([]);
  });

  it('counts a swap of neighbouring letters as one edit, so swapped letters are corrected in short words too', () => {
    expect(editDistance('chrage', 'charge')).toBe(1);
    expect(editDistance('seal', 'sale')).toBe(2);
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    const w = vocab([
      ['charge', 50],
      ['curage', 1],
      ['shaft', 3],
    ]);
    // One edit from both, by a swap and by a replacement: the common word wins.
    expect(w.corrections('chrage')).toEqual(['charge', 'curage']);
    expect(w.corrections('shfat')).toEqual(['shaft']);
  });

  it('does not correct short words or numbers, and allows more edits for longer words', () => {
    expect(maxEditsFor('sel')).toBe(0);
    expect(maxEditsFor('seals')).toBe(1);
    expect(maxEditsFor('propeler')).toBe(2);
    expect(maxEditsFor('48v12')).toBe(0);
    expect(v.corrections('sel')).toEqual([]);
  });

  it('adds new words and reports which were new; a count only grows', () => {
    const w = vocab([['seal', 3]]);
    expect(w.addAll(['seal', 'gland', 'gland'])).toEqual(['gland']);
    w.add('seal', 1);
    expect(w.corrections('seel')).toEqual(['seal']);
    expect(w.size).toBe(2);
  });
});
