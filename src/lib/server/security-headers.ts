import { STATUS_CODES } from 'node:http';

/** Our policy without its script-src, which each page gets from the scripts Astro hashed at build time. */
const POLICY = [
  "default-src 'self'",
  // Styles: the editor and the charts inject <style> elements and inline style attributes at run time.
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  // The offline service worker (/sw.js) and the web app manifest, both from our own origin only.
  "worker-src 'self'",
  "manifest-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const HEADERS: Record<string, string> = {
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'same-origin',
  'x-frame-options': 'DENY',
};

// A source that may stand in our script-src: the site itself or the hash of a script.
const HASH_SOURCE = /^'sha(?:256|384|512)-[A-Za-z0-9+/]+={0,2}'$/;

/**
 * The policy of an HTML page. Astro (experimental.csp in astro.config.mjs) names in the page's own policy header
 * the hashes of the inline scripts it writes itself, computed at build time from its island loaders and bundled
 * scripts; only those hashes are kept. Nothing found in the rendered HTML is trusted, so a script that user content
 * managed to place in a page would not run. The dev server does not compute hashes, so there inline scripts are
 * allowed.
 */
export function pagePolicy(astroPolicy: string | null): string {
  if (import.meta.env.MODE === 'development') return `${POLICY}; script-src 'self' 'unsafe-inline'`;
  const declared = astroPolicy ? /(?:^|;)\s*script-src\s+([^;]*)/.exec(astroPolicy)?.[1] : undefined;
  const hashes = new Set((declared ?? '').split(/\s+/).filter((source) => HASH_SOURCE.test(source)));
  return `${POLICY}; script-src 'self'${[...hashes].map((h) => ` ${h}`).join('')}`;
}

/** Responses that are not pages run no script at all. */
const NON_PAGE_POLICY = `${POLICY}; script-src 'self'`;

/**
 * Adds the headers every response carries. A route that set its own policy on a non-page answer (attachments are
 * served sandboxed) keeps it.
 */
export function withSecurityHeaders(response: Response): Response {
  let out = response;
  // A page that sets Astro.response.status keeps the renderer's "OK": the status line then read "403 OK".
  const phrase = STATUS_CODES[response.status];
  const wrongPhrase = !!phrase && response.statusText !== '' && response.statusText !== phrase;
  try {
    if (wrongPhrase) throw new Error('rebuild with the right reason phrase');
    apply(out.headers);
  } catch {
    // Response.redirect() and fetch responses have immutable headers: copy into a new response.
    out = new Response(response.body, {
      status: response.status,
      statusText: phrase ?? response.statusText,
      headers: new Headers(response.headers),
    });
    apply(out.headers);
  }
  return out;
}

function apply(headers: Headers): void {
  const page = (headers.get('content-type') ?? '').startsWith('text/html');
  const own = headers.get('content-security-policy');
  if (page) headers.set('content-security-policy', pagePolicy(own));
  else if (!own) headers.set('content-security-policy', NON_PAGE_POLICY);
  for (const [k, v] of Object.entries(HEADERS)) if (!headers.has(k)) headers.set(k, v);
}
