import { createHash } from 'node:crypto';

/** The policy without its script-src, which is built per HTML page from the hashes of its inline scripts. */
const POLICY = [
  "default-src 'self'",
  // Styles: the editor and the charts inject <style> elements and inline style attributes at run time.
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const HEADERS: Record<string, string> = {
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'same-origin',
  'x-frame-options': 'DENY',
  // Responses that are not HTML pages run no script at all.
  'content-security-policy': `${POLICY}; script-src 'self'`,
};

/**
 * Adds the headers every response carries, keeping any a route set itself. An HTML page is read whole so its
 * policy can allow exactly the inline scripts it contains (Astro's island loaders) by their SHA-256 hashes,
 * instead of allowing every inline script.
 */
export async function withSecurityHeaders(response: Response): Promise<Response> {
  const html = response.body && (response.headers.get('content-type') ?? '').startsWith('text/html');
  if (html) {
    const text = await response.text();
    const headers = new Headers(response.headers);
    if (!headers.has('content-security-policy')) headers.set('content-security-policy', policyFor(text));
    apply(headers);
    return new Response(text, { status: response.status, statusText: response.statusText, headers });
  }
  let out = response;
  try {
    apply(out.headers);
  } catch {
    // Response.redirect() and fetch responses have immutable headers: copy into a new response.
    out = new Response(response.body, {
      status: response.status,
      statusText: response.statusText,
      headers: new Headers(response.headers),
    });
    apply(out.headers);
  }
  return out;
}

function apply(headers: Headers): void {
  for (const [k, v] of Object.entries(HEADERS)) if (!headers.has(k)) headers.set(k, v);
}

// An inline script: a <script> element without a src attribute, up to its closing tag.
const INLINE_SCRIPT = /<script\b((?:[^>"']|"[^"]*"|'[^']*')*)>([\s\S]*?)<\/script\s*>/gi;
const hashes = new Map<string, string>();

/** The page's content security policy: 'self' plus the hash of each inline script the page carries. */
export function policyFor(html: string): string {
  const allowed = new Set<string>();
  for (const m of html.matchAll(INLINE_SCRIPT)) {
    if (/\bsrc\s*=/i.test(m[1]) || m[2].length === 0) continue;
    // Data blocks (JSON) are never run, so they need no hash.
    const type = /\btype\s*=\s*["']?([^"'\s>]+)/i.exec(m[1])?.[1].toLowerCase();
    if (type && type !== 'module' && type !== 'text/javascript' && type !== 'application/javascript') continue;
    allowed.add(scriptHash(m[2]));
  }
  return `${POLICY}; script-src 'self'${[...allowed].map((h) => ` '${h}'`).join('')}`;
}

function scriptHash(source: string): string {
  let h = hashes.get(source);
  if (!h) {
    h = `sha256-${createHash('sha256').update(source, 'utf8').digest('base64')}`;
    // The same few loader scripts recur on every page; keep the memo small in case a page inlines data.
    if (hashes.size > 256) hashes.clear();
    hashes.set(source, h);
  }
  return h;
}
