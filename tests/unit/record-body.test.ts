import { describe, it, expect } from 'vitest';
import { processBody } from '../../src/lib/server/records/body';
import { HttpError } from '../../src/lib/server/http';
import { templateFor } from '../../src/lib/editor/templates';
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
