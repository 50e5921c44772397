import { describe, it, expect } from 'vitest';
import { inWords, rolloverSentences } from '../../src/lib/rollover-text';

describe('rollover preview sentences', () => {
  it('joins names in words', () => {
    expect(inWords([])).toBe('');
    expect(inWords(['Hull'])).toBe('Hull');
    expect(inWords(['Hull', 'Cooling'])).toBe('Hull and Cooling');
    expect(inWords(['Hull', 'Cooling', 'Solar array'])).toBe('Hull, Cooling and Solar array');
  });

  it('writes sentences with names, from the current to the new season, never a slug or a dangling ";"', () => {
    const lines = rolloverSentences('2025–26', '2026–27', [
      {
        userId: 'a',
        name: 'Jonas Lindqvist',
        change: 'continues',
        subsystemNames: ['Propulsion and motor drive', 'Cooling'],
      },
      { userId: 'b', name: 'Hanna Voss', change: 'to-alumni', subsystemNames: ['Hull and foils'] },
      { userId: 'c', name: 'Ola Berg', change: 'to-alumni', subsystemNames: [] },
    ]);
    expect(lines[0]).toBe('2026–27 becomes the current season, and 2025–26 moves into the archive.');
    expect(lines).toContain(
      'Jonas Lindqvist continues as a member of 2026–27 and keeps Propulsion and motor drive and Cooling.',
    );
    expect(lines).toContain(
      'Hanna Voss and Ola Berg become alumni: they keep reading and answering questions, but stop editing.',
    );
    for (const l of lines) {
      expect(l).toMatch(/\.$/);
      expect(l).not.toMatch(/;\s*$/);
    }
  });

  it('says so when nobody is a member', () => {
    expect(rolloverSentences('A', 'B', [])).toContain('Nobody’s role changes: A has no members.');
  });
});
