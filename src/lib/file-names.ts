/** File names, pure (shared by uploads and the handover bundle). */

// An "extension" longer than this is more likely part of the name ("notes.from the tank test").
const MAX_EXTENSION = 16;

/**
 * Cuts a name to at most `max` characters (code points, so no character is split) and keeps its extension:
 * the end of the stem goes, not the ".csv".
 */
export function cutFileName(name: string, max = 180): string {
  const chars = Array.from(name);
  if (chars.length <= max) return name;
  const dot = name.lastIndexOf('.');
  const ext = dot > 0 ? Array.from(name.slice(dot)) : [];
  if (ext.length < 2 || ext.length > MAX_EXTENSION || /\s/.test(ext.join(''))) return chars.slice(0, max).join('');
  const stem = Array.from(name.slice(0, dot))
    .slice(0, max - ext.length)
    .join('')
    .replace(/[\s.]+$/, '');
  return `${stem || 'file'}${ext.join('')}`;
}
