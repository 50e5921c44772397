const HEADERS: Record<string, string> = {
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'same-origin',
  'x-frame-options': 'DENY',
  // Astro's island hydration uses small inline module scripts, so scripts need 'unsafe-inline' for now.
  'content-security-policy': [
    "default-src 'self'",
    "script-src 'self' 'unsafe-inline'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; '),
};

/** Adds the headers every response carries, keeping any a route set itself. */
export function withSecurityHeaders(response: Response): Response {
  let out = response;
  try {
    apply(out.headers);
  } catch {
    // Response.redirect() and fetch responses have immutable headers: copy into a new response.
    out = new Response(response.body, { status: response.status, statusText: response.statusText, headers: new Headers(response.headers) });
    apply(out.headers);
  }
  return out;
}

function apply(headers: Headers): void {
  for (const [k, v] of Object.entries(HEADERS)) if (!headers.has(k)) headers.set(k, v);
}
