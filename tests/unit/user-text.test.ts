// What users read never says "(memory)" or points at files they cannot see, and formulas in guides are math
// (typeset on the server by remark-math + rehype-katex), not code spans.
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { calculators } from '../../src/lib/calc';
import { guideHeadings } from '../../src/lib/guide-headings';
import { plainSymbols, symbolParts } from '../../src/lib/symbols';

const INTERNAL = /\(memory\)|\bmemory\)|,\s*memory\b|REFERENCES|§\s*\d/;
const base = 'src/content/guides';
const guides = readdirSync(base, { recursive: true })
  .map(String)
  .filter((f) => f.endsWith('.mdx'));
const pages = readdirSync('src/pages', { recursive: true })
  .map(String)
  .filter((f) => f.endsWith('.astro'));

describe('text users read', () => {
  it.each(guides)('guide %s: no "(memory)", no pointer at internal files, formulas as math', (f) => {
    const text = readFileSync(join(base, f), 'utf8');
    expect(text).not.toMatch(INTERNAL);
    // A code span with an equals sign or a multiplication is a formula shown as code.
    expect(text.match(/`[^`\n]*[=×≈][^`\n]*`/g) ?? []).toEqual([]);
  });

  it('every guide with a formula has it as $…$ or $$…$$', () => {
    const withMath = guides.filter((f) => /\$[^$\n]+\$/.test(readFileSync(join(base, f), 'utf8')));
    expect(withMath.length).toBeGreaterThanOrEqual(8);
  });

  it.each(Object.keys(calculators))('calculator %s: help, sources, cautions and warnings text', (kind) => {
    const calc = calculators[kind as keyof typeof calculators];
    expect(JSON.stringify({ ...calc, compute: undefined })).not.toMatch(INTERNAL);
  });

  // A symbol in underscore notation (K_T, p_atm); machine names such as friction_factor in a citation are not one.
  const SYMBOL = /(?<![A-Za-z0-9_])\p{L}_\S/u;
  // Labels, help and option names are shown through symbolParts (HTML, K<sub>T</sub>) or plainSymbols (charts,
  // options, titles): whatever a calculator writes, neither may leave an underscore before a letter on screen.
  it.each(Object.keys(calculators))('calculator %s: no "_" before a letter once its symbols are shown', (kind) => {
    const calc = calculators[kind as keyof typeof calculators];
    const shown = [
      ...calc.inputs.flatMap((i) => [i.label, i.help, ...(i.options ?? []).map((o) => o.label)]),
      ...calc.outputs.flatMap((o) => [o.label, o.help ?? '']),
      ...calc.sources.flatMap((s) => [s.use, s.citation]),
      calc.summary,
      ...calc.cautions,
    ];
    for (const text of shown) {
      expect(plainSymbols(text), text).not.toMatch(SYMBOL);
      for (const part of symbolParts(text)) expect(part.text, text).not.toMatch(SYMBOL);
    }
  });

  it.each(pages)('page %s', (f) => {
    expect(readFileSync(join('src/pages', f), 'utf8')).not.toMatch(INTERNAL);
  });
});

describe('guide headings (the sections a suggestion can point at)', () => {
  it('reads ## and ### headings, skipping fenced code and stripping marks', () => {
    const md = [
      '# Title',
      '## First *part*',
      'text',
      '```',
      '## not a heading',
      '```',
      '### Sub `code`',
      '#### deep',
    ].join('\n');
    expect(guideHeadings(md)).toEqual([
      { depth: 2, text: 'First part' },
      { depth: 3, text: 'Sub code' },
    ]);
  });
});
