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

/** The address the app serves an attachment at; an image in a record's text may point only here. */
const ATTACHMENT_SRC = /^\/api\/attachments\/([a-z0-9]{8,40})$/;

/** True for exactly "/api/attachments/<id>": no other site, scheme, query, fragment or path trick. */
export function isAttachmentSrc(src: unknown): src is string {
  return typeof src === 'string' && ATTACHMENT_SRC.test(src);
}

/** The attachment id an image's `src` names, or null when it names none. */
export function attachmentIdOf(src: unknown): string | null {
  return typeof src === 'string' ? (ATTACHMENT_SRC.exec(src)?.[1] ?? null) : null;
}
