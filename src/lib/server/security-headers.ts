import { STATUS_CODES } from 'node:http';

/** Our policy without its script-src. */
const POLICY = [
  "default-src 'self'",
  // Styles: the editor and the charts inject <style> elements and inline style attributes at run time, and
  // Astro inlines small stylesheets into the head.
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

/** Pages run only our own script files; other responses (JSON, files) run none of theirs either. */
const OWN_SCRIPTS_ONLY = `${POLICY}; script-src 'self'`;

/**
 * The policy of an HTML page: scripts only from our own files. Pages carry no inline script at all (islands are
 * mounted by one bundled module, src/scripts/islands.ts, and every <script> is bundled to a file), so nothing is
 * hashed and nothing found in a rendered page can ever be allowed. The dev server injects inline scripts of its
 * own, so there they are allowed.
 */
export function pagePolicy(): string {
  if (import.meta.env.MODE === 'development') return `${POLICY}; script-src 'self' 'unsafe-inline'`;
  return OWN_SCRIPTS_ONLY;
}

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
  if (page) headers.set('content-security-policy', pagePolicy());
  else if (!own) headers.set('content-security-policy', OWN_SCRIPTS_ONLY);
  for (const [k, v] of Object.entries(HEADERS)) if (!headers.has(k)) headers.set(k, v);
}
