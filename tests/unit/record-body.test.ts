import { describe, it, expect } from 'vitest';
import { processBody } from '../../src/lib/server/records/body';
import { HttpError } from '../../src/lib/server/http';
import { DECISION_SECTIONS, LESSON_SECTIONS, SECTION_PROMPTS, templateFor } from '../../src/lib/editor/templates';
import { markdownToDoc } from '../../src/lib/server/demo/markdown';

const para = (content: object[]) => ({ type: 'doc', content: [{ type: 'paragraph', content }] });

describe('processBody: validate, sanitise, render', () => {
  it('renders headings, lists and marks to HTML and plain text', () => {
    const out = processBody(markdownToDoc('## Context\n\nWe **chose** *two* props.\n\n- sprint\n- endurance\n'));
    expect(out.html).toBe(
      '<h2>Context</h2><p>We <strong>chose</strong> <em>two</em> props.</p><ul><li><p>sprint</p></li><li><p>endurance</p></li></ul>',
    );
    expect(out.text).toContain('We chose two props.');
  });

  it('escapes text that looks like markup', () => {
    const out = processBody(para([{ type: 'text', text: '<img src=x onerror=alert(1)><script>x</script>' }]));
    expect(out.html).not.toMatch(/<img|<script/);
    expect(out.html).toContain('&lt;img src=x onerror=alert(1)&gt;');
  });

  it('drops javascript:, data: and obfuscated links but keeps https, mailto and site paths', () => {
    const link = (href: string) => ({ type: 'text', text: href, marks: [{ type: 'link', attrs: { href } }] });
    const out = processBody(
      para([
        link('javascript:alert(1)'),
        link('data:text/html,x'),
        link('java\nscript:alert(1)'),
        link('https://example.org/'),
        link('mailto:a@b.c'),
        link('/records/x'),
      ]),
    );
    expect(out.html.match(/<a /g)).toHaveLength(3);
    expect(out.html).not.toMatch(/href="(javascript|data|java)/);
    const hrefs = JSON.stringify(out.doc).match(/"href":"[^"]*"/g);
    expect(hrefs).toEqual(['"href":"https://example.org/"', '"href":"mailto:a@b.c"', '"href":"/records/x"']);
  });

  it('drops attributes the schema does not know (event handlers, styles)', () => {
    const out = processBody({
      type: 'doc',
      content: [
        {
          type: 'heading',
          attrs: { level: 2, onclick: 'x', style: 'color:red' },
          content: [{ type: 'text', text: 'H' }],
        },
      ],
    });
    expect(out.html).toBe('<h2>H</h2>');
  });

  it.each([
    ['not an object', 'hello'],
    ['an array', []],
    ['the wrong root', { type: 'paragraph' }],
    ['an unknown node', { type: 'doc', content: [{ type: 'script', content: [] }] }],
    ['text directly in the document', { type: 'doc', content: [{ type: 'text', text: 'bare' }] }],
    [
      'a heading level the editor does not offer',
      { type: 'doc', content: [{ type: 'heading', attrs: { level: 7 }, content: [] }] },
    ],
  ])('refuses %s with a 400 on path body', (_name, body) => {
    try {
      processBody(body);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(HttpError);
      expect((e as HttpError).status).toBe(400);
      expect((e as HttpError).issues[0].path).toBe('body');
    }
  });

  it('repairs a stored revision with a bad attribute value instead of refusing it (history view)', () => {
    const stored = { type: 'doc', content: [{ type: 'codeBlock', attrs: { language: 'x" onmouseover=alert(1)' } }] };
    expect(() => processBody(stored)).toThrow(HttpError);
    const out = processBody(stored, { repair: true });
    expect(out.html).toBe('<pre><code></code></pre>');
    expect(processBody({ ...stored, content: [{ type: 'codeBlock', attrs: { language: 'c++' } }] }).html).toContain(
      'class="language-c++"',
    );
  });

  describe('images: only an attachment of the app, with a plain description', () => {
    const image = (attrs: object) => ({ type: 'doc', content: [{ type: 'image', attrs }] });
    it('keeps an image of an attachment address, with only src, alt and title, rendered lazily', () => {
      const out = processBody(
        image({
          src: '/api/attachments/abcdefgh23456789',
          alt: 'Chine "close-up" <b>',
          width: 900,
          style: 'x',
          class: 'y',
        }),
      );
      expect(out.doc.content).toEqual([
        {
          type: 'image',
          attrs: { src: '/api/attachments/abcdefgh23456789', alt: 'Chine "close-up" <b>', title: null },
        },
      ]);
      expect(out.html).toBe(
        '<img loading="lazy" src="/api/attachments/abcdefgh23456789" alt="Chine &quot;close-up&quot; <b>">',
      );
    });

    it.each([
      ['an external address', 'https://example.org/a.png'],
      ['a protocol-relative address', '//example.org/api/attachments/abcdefgh23456789'],
      ['a data: URL', 'data:image/png;base64,iVBORw0KGgo='],
      ['a javascript: URL', 'javascript:alert(1)'],
      ['an obfuscated javascript: URL', 'java\nscript:alert(1)'],
      ['a path that climbs out', '/api/attachments/../../admin'],
      ['another path on the site', '/records/abcdefgh23456789'],
      ['a query on an attachment', '/api/attachments/abcdefgh23456789?x=1'],
      ['no address', undefined],
    ])('refuses an image with %s (400 on path body); repairing a stored one drops it', (_name, src) => {
      const doc = image({ src, alt: 'x' });
      try {
        processBody(doc);
        expect.unreachable();
      } catch (e) {
        expect((e as HttpError).status).toBe(400);
        expect((e as HttpError).issues[0].path).toBe('body');
      }
      expect(processBody(doc, { repair: true }).html).not.toContain('<img');
    });

    it('refuses a description that is too long or holds control characters', () => {
      const src = '/api/attachments/abcdefgh23456789';
      expect(() => processBody(image({ src, alt: 'a'.repeat(501) }))).toThrow(HttpError);
      expect(() => processBody(image({ src, alt: 'a\u0000b' }))).toThrow(HttpError);
      expect(processBody(image({ src, alt: 'a'.repeat(500) })).html).toContain('<img');
    });

    it('puts the description nowhere in the plain text and renders no image inside a paragraph', () => {
      const out = processBody({
        type: 'doc',
        content: [
          { type: 'paragraph', content: [{ type: 'text', text: 'Before' }] },
          { type: 'image', attrs: { src: '/api/attachments/abcdefgh23456789', alt: 'seal' } },
        ],
      });
      expect(out.text).toBe('Before');
      expect(() => processBody(para([{ type: 'image', attrs: { src: '/api/attachments/abcdefgh23456789' } }]))).toThrow(
        HttpError,
      );
    });
  });

  it('refuses a document nested thousands of levels deep with a 400, not a stack overflow', () => {
    let deep: Record<string, unknown> = { type: 'paragraph' };
    for (let i = 0; i < 20_000; i++) deep = { type: 'blockquote', content: [deep] };
    expect(() => processBody({ type: 'doc', content: [deep] })).toThrow(HttpError);
  });

  it('accepts the new-record templates of both kinds', () => {
    expect(processBody(templateFor('decision')).html).toContain('<h2>Options considered</h2>');
    expect(processBody(templateFor('lesson')).html).toContain('<h2>Recommendation for the next cohort</h2>');
  });
});

describe('normalising what the editor sends', () => {
  const item = (text?: string) => ({
    type: 'listItem',
    content: [{ type: 'paragraph', ...(text ? { content: [{ type: 'text', text }] } : {}) }],
  });
  const list = (type: string, items: object[]) => ({ type: 'doc', content: [{ type, content: items }] });

  it('leaves out an empty item at the end of a list (what Enter leaves behind), and only at the end', () => {
    const out = processBody(list('bulletList', [item('Keep the 6 mm² cable'), item(), item(' ')]));
    expect(out.doc.content![0].content).toHaveLength(1);
    expect(out.html).toBe('<ul><li><p>Keep the 6 mm² cable</p></li></ul>');
    // An empty item between two written ones is the writer's choice and stays.
    const middle = processBody(list('orderedList', [item('one'), item(), item('three')]));
    expect(middle.doc.content![0].content).toHaveLength(3);
  });

  it('does the same in nested lists and task lists; a list left with no items goes', () => {
    const nested = processBody(
      list('bulletList', [
        {
          type: 'listItem',
          content: [
            { type: 'paragraph', content: [{ type: 'text', text: 'Cells' }] },
            { type: 'bulletList', content: [item('LFP'), item()] },
          ],
        },
        item(),
      ]),
    );
    expect(nested.html).toBe('<ul><li><p>Cells</p><ul><li><p>LFP</p></li></ul></li></ul>');
    const tasks = processBody({
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'Checks' }] },
        {
          type: 'taskList',
          content: [{ type: 'taskItem', attrs: { checked: false }, content: [{ type: 'paragraph' }] }],
        },
      ],
    });
    expect(tasks.doc.content!.map((n) => n.type)).toEqual(['paragraph']);
    // A document that was one empty list still stores as a document.
    expect(processBody(list('bulletList', [item()])).doc).toEqual({ type: 'doc', content: [{ type: 'paragraph' }] });
  });

  it('drops a section prompt an older editor stored as italic text, and keeps text that only starts like one', () => {
    const legacy = {
      type: 'doc',
      content: [
        { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Decision' }] },
        {
          type: 'paragraph',
          content: [{ type: 'text', marks: [{ type: 'italic' }], text: 'What you chose, and the deciding reason.' }],
        },
        { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Consequences' }] },
        {
          type: 'paragraph',
          content: [{ type: 'text', text: 'What this makes easier or harder: the swap needs a second hub.' }],
        },
      ],
    };
    const out = processBody(legacy);
    expect(out.text).not.toContain('What you chose');
    expect(out.text).toContain('the swap needs a second hub');
    expect(out.doc.content!.map((n) => n.type)).toEqual(['heading', 'heading', 'paragraph']);
  });

  it('stores the new-record template with neither prompt text nor any italic mark', () => {
    for (const kind of ['decision', 'lesson'] as const) {
      const out = processBody(templateFor(kind));
      const json = JSON.stringify(out.doc);
      expect(json).not.toContain('italic');
      for (const prompt of SECTION_PROMPTS) expect(out.text).not.toContain(prompt);
      expect(out.text.split('\n').filter(Boolean)).toEqual(
        kind === 'decision' ? [...DECISION_SECTIONS] : [...LESSON_SECTIONS],
      );
    }
  });
});
