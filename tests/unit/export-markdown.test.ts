import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { docToMarkdown, escapeText } from '../../src/lib/server/export/markdown';
import { markdownToDoc } from '../../src/lib/server/demo/markdown';
import { processBody } from '../../src/lib/server/records/body';
import { nameForType, slugify, safeFileName } from '../../src/lib/server/export/names';

const text = (t: string, marks?: { type: string; attrs?: Record<string, unknown> }[]) => ({
  type: 'text',
  text: t,
  ...(marks ? { marks } : {}),
});
const p = (...content: object[]) => ({ type: 'paragraph', content });
const doc = (...content: object[]) => ({ type: 'doc', content });

describe('docToMarkdown', () => {
  it('writes an image as Markdown with its description, its address rewritten into the bundle', () => {
    const image = { type: 'image', attrs: { src: '/api/attachments/abcdefgh23456789', alt: 'Seal [wet] photo' } };
    const md = docToMarkdown(doc(p(text('Before')), image), {
      src: (s) => (s === '/api/attachments/abcdefgh23456789' ? '../attachments/seal/photo 1.png' : s),
    });
    expect(md).toBe('Before\n\n![Seal \\[wet\\] photo](../attachments/seal/photo%201.png)\n');
    expect(docToMarkdown(doc({ type: 'image', attrs: { src: '/api/attachments/x1234567' } }))).toBe(
      '![](/api/attachments/x1234567)\n',
    );
  });

  it('writes headings, marks, links and breaks', () => {
    const md = docToMarkdown(
      doc(
        { type: 'heading', attrs: { level: 2 }, content: [text('Context')] },
        p(
          text('Use '),
          text('foam', [{ type: 'bold' }]),
          text(' and '),
          text('glass ', [{ type: 'italic' }]),
          text('cloth '),
          text('x = 1', [{ type: 'code' }]),
          text('.'),
        ),
        p(
          text('see '),
          text('the rules', [{ type: 'link', attrs: { href: 'https://example.org/a b' } }]),
          { type: 'hardBreak' },
          text('next line'),
        ),
      ),
    );
    expect(md).toBe(
      '## Context\n\nUse **foam** and _glass_ cloth `x = 1`.\n\nsee [the rules](https://example.org/a%20b)\\\nnext line\n',
    );
  });

  it('writes nested lists, task lists, quotes, code blocks and rules', () => {
    const md = docToMarkdown(
      doc(
        {
          type: 'bulletList',
          content: [
            {
              type: 'listItem',
              content: [
                p(text('one')),
                {
                  type: 'orderedList',
                  attrs: { start: 3 },
                  content: [{ type: 'listItem', content: [p(text('three'))] }],
                },
              ],
            },
          ],
        },
        {
          type: 'taskList',
          content: [
            { type: 'taskItem', attrs: { checked: true }, content: [p(text('done'))] },
            { type: 'taskItem', attrs: { checked: false }, content: [p(text('open'))] },
          ],
        },
        { type: 'blockquote', content: [p(text('Safety first.')), p(text('Always.'))] },
        { type: 'codeBlock', attrs: { language: 'text' }, content: [text('V = I * R')] },
        { type: 'horizontalRule' },
      ),
    );
    expect(md).toBe(
      '- one\n\n  3. three\n\n- [x] done\n- [ ] open\n\n> Safety first.\n>\n> Always.\n\n```text\nV = I * R\n```\n\n---\n',
    );
  });

  it('escapes text that Markdown would read as syntax', () => {
    expect(escapeText('2*3 = 6_a [x] <b>')).toBe('2\\*3 = 6\\_a \\[x\\] \\<b\\>');
    expect(escapeText('# not a heading')).toBe('\\# not a heading');
    expect(escapeText('1. not a list')).toBe('1\\. not a list');
  });

  it('rewrites link targets when asked', () => {
    const md = docToMarkdown(doc(p(text('older', [{ type: 'link', attrs: { href: '/records/abc' } }]))), {
      href: (h) => h.replace('/records/abc', '../records/older-abc.md'),
    });
    expect(md).toBe('[older](../records/older-abc.md)\n');
  });

  // Round trip through the demo's own Markdown reader: every demo record comes back as the same editor document.
  const dir = 'content/demo/records';
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.md'))) {
    it(`round-trips the demo record ${file}`, () => {
      const source = readFileSync(join(dir, file), 'utf8').replace(/^---\n[\s\S]*?\n---\n/, '');
      const original = processBody(markdownToDoc(source)).doc;
      const again = processBody(markdownToDoc(docToMarkdown(original))).doc;
      expect(again).toEqual(original);
    });
  }
});

describe('bundle names', () => {
  it('makes readable, safe slugs and file names', () => {
    expect(slugify('Build the Tern 3 hull: 10 mm foam — glass/epoxy!')).toBe(
      'build-the-tern-3-hull-10-mm-foam-glass-epoxy',
    );
    expect(slugify('***')).toBe('untitled');
    expect(safeFileName('../../etc/passwd')).toBe('passwd');
    expect(safeFileName('a:b?.csv')).toBe('a_b_.csv');
    expect(safeFileName('.hidden')).toBe('_hidden');
  });
  it('cuts a long name at 180 characters and keeps its extension', () => {
    const cut = safeFileName(`${'battery-pack-thermal-run-'.repeat(10)}final.csv`);
    expect(cut.length).toBeLessThanOrEqual(180);
    expect(cut).toMatch(/^battery-pack-thermal-run-.*[^.]\.csv$/);
    expect(safeFileName('short.csv')).toBe('short.csv');
    // No extension to keep: cut plainly.
    expect(safeFileName('x'.repeat(300))).toBe('x'.repeat(180));
  });
  it('gives a file the extension of its sniffed type unless its own is one that type is known by', () => {
    expect(nameForType('log.html', 'text/csv')).toBe('log.html.csv');
    expect(nameForType('page.html', 'text/plain')).toBe('page.html.txt');
    expect(nameForType('photo.JPEG', 'image/jpeg')).toBe('photo.JPEG');
    expect(nameForType('scan', 'application/pdf')).toBe('scan.pdf');
    expect(nameForType('notes.txt', 'text/plain')).toBe('notes.txt');
  });
});
