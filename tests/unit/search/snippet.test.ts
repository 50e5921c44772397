import { describe, it, expect } from 'vitest';
import { escapeHtml, highlightHtml, snippetHtml } from '../../../src/lib/server/search/snippet';

const h = (exact: string[], prefixes: string[] = []) => ({ exact: new Set(exact), prefixes });

describe('highlightHtml', () => {
  it('marks whole matched words, case- and accent-blind, and nothing else', () => {
    expect(highlightHtml('Propeller ventilation at the propellers', h(['propeller'], ['vent']))).toBe(
      '<mark>Propeller</mark> <mark>ventilation</mark> at the propellers',
    );
    expect(highlightHtml('A naïve guess', h(['naive']))).toBe('A <mark>naïve</mark> guess');
  });

  it('escapes stored text: markup in a title or body stays text, only our <mark> is added', () => {
    const out = highlightHtml('<script>alert("x")</script> & <b onmouseover=1>seal</b>', h(['seal', 'script']));
    expect(out).toBe(
      '&lt;<mark>script</mark>&gt;alert(&quot;x&quot;)&lt;/<mark>script</mark>&gt; &amp; &lt;b onmouseover=1&gt;<mark>seal</mark>&lt;/b&gt;',
    );
    expect(out.replace(/<\/?mark>/g, '')).not.toMatch(/[<>]/);
  });

  it('drops control characters and folds whitespace', () => {
    expect(highlightHtml('seal\u0000\u0001\u0002 leak\n\nagain', h(['leak']))).toBe('seal <mark>leak</mark> again');
  });

  it('escapes the five HTML specials', () => {
    expect(escapeHtml(`<>&"'`)).toBe('&lt;&gt;&amp;&quot;&#39;');
  });
});

describe('snippetHtml', () => {
  const words = (n: number, from = 0) => Array.from({ length: n }, (_, i) => `w${i + from}`).join(' ');

  it('quotes the passage holding the most different query words, with ellipses where it was cut', () => {
    const text = `${words(40)} shaft ${words(40, 100)} shaft seal ${words(40, 200)}`;
    const out = snippetHtml(text, h(['shaft', 'seal']), 10);
    expect(out).toContain('<mark>shaft</mark> <mark>seal</mark>');
    expect(out.startsWith('…')).toBe(true);
    expect(out.endsWith('…')).toBe(true);
    expect(
      out
        .replace(/<\/?mark>/g, '')
        .replace(/…/g, '')
        .trim()
        .split(' '),
    ).toHaveLength(10);
  });

  it('starts at the beginning, without an ellipsis, when nothing in the body matched', () => {
    expect(snippetHtml(`${words(30)}`, h(['absent']), 5)).toBe('w0 w1 w2 w3 w4…');
  });

  it('returns a short text whole', () => {
    expect(snippetHtml('Check the <seal>', h(['seal']), 24)).toBe('Check the &lt;<mark>seal</mark>&gt;');
    expect(snippetHtml('', h(['seal']))).toBe('');
  });
});
