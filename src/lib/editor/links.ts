/**
 * Only these link targets survive in stored records: the web (http, https), e-mail (mailto), and paths on this
 * site ("/records/…"), never scripts, data or other schemes.
 */
export function isSafeHref(href: unknown): href is string {
  if (typeof href !== 'string' || href.length > 2048) return false;
  const trimmed = href.trim();
  // Browsers ignore control characters and whitespace inside a scheme ("java\tscript:"); so do we, before checking.
  const collapsed = trimmed.replace(/[\u0000-\u0020\u007f]+/g, '').toLowerCase();
  if (/^\/(?![/\\])/.test(trimmed) && /^\/(?![/\\])/.test(collapsed)) return true;
  return /^(https?:\/\/|mailto:)/.test(collapsed) && /^(https?:\/\/|mailto:)/i.test(trimmed);
}
