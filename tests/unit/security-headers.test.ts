import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { policyFor, withSecurityHeaders } from '../../src/lib/server/security-headers';

const sha = (s: string) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`;

describe('content security policy', () => {
  it('allows exactly the inline scripts of the page by hash, never unsafe-inline scripts', () => {
    const loader = '(()=>{customElements.define("x-island",class extends HTMLElement{})})();';
    const html = `<html><head><script type="module" src="/_astro/a.js"></script><script>${loader}</script>
      <script type="application/json" id="data">{"a":1}</script><script type="module">import "/_astro/b.js";</script></head></html>`;
    const policy = policyFor(html);
    const scriptSrc = policy.split('; ').find((d) => d.startsWith('script-src'))!;
    expect(scriptSrc).toBe(`script-src 'self' ${sha(loader)} ${sha('import "/_astro/b.js";')}`);
    expect(scriptSrc).not.toContain('unsafe-inline');
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("object-src 'none'");
  });

  it('a page without inline scripts allows only its own files', () => {
    expect(policyFor('<p>no scripts</p>')).toContain("script-src 'self'");
    expect(policyFor('<p>no scripts</p>')).not.toContain('sha256-');
  });

  it('adds the headers to HTML and to other responses, keeping ones a route set', async () => {
    const page = await withSecurityHeaders(
      new Response('<script>go()</script>', { headers: { 'content-type': 'text/html' } }),
    );
    expect(page.headers.get('content-security-policy')).toContain(sha('go()'));
    expect(await page.text()).toBe('<script>go()</script>');
    const json = await withSecurityHeaders(
      new Response('{}', { headers: { 'content-type': 'application/json', 'referrer-policy': 'no-referrer' } }),
    );
    expect(json.headers.get('x-content-type-options')).toBe('nosniff');
    expect(json.headers.get('referrer-policy')).toBe('no-referrer');
    expect(json.headers.get('content-security-policy')).toContain("script-src 'self'");
    const redirect = await withSecurityHeaders(Response.redirect('http://localhost/next', 302));
    expect(redirect.headers.get('x-frame-options')).toBe('DENY');
  });
});
