import { describe, it, expect } from 'vitest';
import { mdxToText, toGuideDoc, loadGuideDocs, fingerprint } from '../../../src/lib/server/search/guides';

describe('mdxToText', () => {
  it('keeps the words and drops imports, components, link targets and Markdown punctuation', () => {
    const mdx = [
      "import LiveCalculator from '../../../components/LiveCalculator.astro';",
      '',
      '## Reading the curves',
      '',
      'See [the propeller calculator](/calculations/new/propeller) and **η₀**.',
      '<LiveCalculator kind="propeller" />',
      '> **Safety.** Keep hands clear of the propeller.',
      '| J | KT |',
      '|---|---|',
      '| 0.5 | 0.271 |',
      '- `J = V_A/(n·D)`',
    ].join('\n');
    const text = mdxToText(mdx);
    expect(text).toContain('Reading the curves');
    expect(text).toContain('See the propeller calculator and η₀.');
    expect(text).toContain('Safety. Keep hands clear of the propeller.');
    expect(text).toContain('J = V_A/(n·D)');
    expect(text).not.toMatch(/import|LiveCalculator|\/calculations\/new|\*\*|##|\||---/);
  });

  it('puts summary, text and tags into the searchable text', () => {
    const doc = toGuideDoc({
      slug: 's',
      title: 'T',
      subsystem: 'hull',
      summary: 'A summary.',
      tags: ['drag', 'wetted-area'],
      body: 'Body words.',
    });
    expect(doc).toEqual({
      slug: 's',
      title: 'T',
      subsystem: 'hull',
      audience: 'everyone',
      text: 'A summary.\n\nBody words.\ndrag wetted-area',
    });
  });
});

describe('loadGuideDocs', () => {
  it('reads the guides of this repository, each with a title, subsystem and text', async () => {
    const guides = await loadGuideDocs();
    expect(guides.length).toBeGreaterThanOrEqual(10);
    const diagram = guides.find((g) => g.slug === 'reading-an-open-water-diagram');
    expect(diagram).toMatchObject({ subsystem: 'propulsion', audience: 'new-members' });
    expect(diagram?.title).toMatch(/open-water diagram/);
    expect(diagram?.text).toMatch(/advance ratio/);
    expect(fingerprint(guides)).toBe(fingerprint(await loadGuideDocs()));
  });
});
