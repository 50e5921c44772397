import { cutFileName } from '../../file-names';
import { EXTENSIONS } from '../filetype';

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

/** A stored file name made safe inside a zip: no folders, no control characters, never empty, extension kept. */
export function safeFileName(name: string): string {
  const base = (name.split(/[\\/]/).pop() ?? '')
    .replace(/[\u0000-\u001f\u007f<>:"|?*]/g, '_')
    .replace(/^\.+/, '_')
    .trim();
  return cutFileName(base) || 'file';
}

/**
 * The name a file is given in the bundle: kept when its extension is one its sniffed type is known by, otherwise
 * the type's own extension is added ("log.html" holding CSV becomes "log.html.csv"), so opening it from the
 * unzipped folder hands it to the program for what it really is, never to a browser as a page.
 */
export function nameForType(name: string, contentType: string): string {
  const known = EXTENSIONS[contentType] ?? [];
  const ext = /\.([^.]+)$/.exec(name)?.[1]?.toLowerCase();
  if (ext && known.includes(ext)) return name;
  return `${name}.${known[0] ?? 'bin'}`;
}

export function recordBase(r: { id: string; title: string }): string {
  return `${slugify(r.title)}-${r.id}`;
}
