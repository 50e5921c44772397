import { describe, it, expect } from 'vitest';
import { isSafeHref } from '../../src/lib/editor/links';

describe('isSafeHref', () => {
  it.each([
    'https://ittc.info/',
    'http://example.org/a?b=c',
    'mailto:lead@wakebook.test',
    '/records/abc',
    'HTTPS://EXAMPLE.ORG',
  ])('keeps %s', (h) => {
    expect(isSafeHref(h)).toBe(true);
  });
  it.each([
    'javascript:alert(1)',
    'JaVaScRiPt:alert(1)',
    'java\tscript:alert(1)',
    ' javascript:alert(1)',
    'data:text/html,<script>',
    'vbscript:x',
    '//evil.example/',
    '/\\evil.example',
    'ftp://x',
    '',
    'x'.repeat(3000),
  ])('drops %s', (h) => {
    expect(isSafeHref(h)).toBe(false);
  });
  it('drops non-strings', () => {
    expect(isSafeHref(undefined)).toBe(false);
    expect(isSafeHref(42)).toBe(false);
  });
});
