/** A file-name-safe, readable slug: lower-case ASCII words joined by hyphens. */
export function slugify(title: string, max = 60): string {
  const s = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, max)
    .replace(/-+$/g, '');
  return s || 'untitled';
}

/** A stored file name made safe inside a zip: no folders, no control characters, never empty. */
export function safeFileName(name: string): string {
  const base = (name.split(/[\\/]/).pop() ?? '')
    .replace(/[\u0000-\u001f\u007f<>:"|?*]/g, '_')
    .replace(/^\.+/, '_')
    .trim();
  return base.slice(0, 180) || 'file';
}

export function recordBase(r: { id: string; title: string }): string {
  return `${slugify(r.title)}-${r.id}`;
}
