// What the import page checks before sending, and says in words. Pure: shared by the page and its islands.

import { IMPORT_EXTENSIONS } from './domain';

const ENDINGS: readonly string[] = IMPORT_EXTENSIONS;

/** For the file picker's `accept`. */
export const IMPORT_ACCEPT = ENDINGS.map((e) => `.${e}`).join(',');

/** The limits of one import, as the server's settings give them. */
export interface ImportLimits {
  /** Largest single document, and largest file inside a zip. */
  fileMb: number;
  /** Largest zip. */
  zipMb: number;
  /** What one import may add up to (also once unzipped). */
  totalMb: number;
  /** Files in one import, counting each file inside a zip. */
  files: number;
}

const MB = 1024 * 1024;

export function fileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < MB) return `${Math.round(bytes / 1024)} kB`;
  return `${(bytes / MB).toFixed(bytes < 10 * MB ? 1 : 0)} MB`;
}

export function endingOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot < 0 ? '' : name.slice(dot + 1).toLowerCase();
}

export function limitsInWords(l: ImportLimits): string[] {
  return [
    `Up to ${l.files} files in one import, counting each file inside a zip.`,
    `Each document up to ${l.fileMb} MB; a zip up to ${l.zipMb} MB.`,
    `All files together up to ${l.totalMb} MB, also once a zip is unpacked. A zip that unpacks to far more than it holds is refused.`,
  ];
}

/** Why a chosen file would be refused before it is sent, or null when it may go. */
export function problemWith(file: { name: string; size: number }, l: ImportLimits): string | null {
  const ending = endingOf(file.name);
  if (!ENDINGS.includes(ending))
    return `${file.name} is not a file an import reads (${ENDINGS.map((e) => `.${e}`).join(' ')}).`;
  if (file.size === 0) return `${file.name} is empty.`;
  const max = ending === 'zip' ? l.zipMb : l.fileMb;
  if (file.size > max * MB)
    return `${file.name} is over ${max} MB, the largest ${ending === 'zip' ? 'zip' : 'file'} an import takes.`;
  return null;
}

/** Why the chosen files as a whole would be refused, or null. */
export function problemWithAll(files: { size: number }[], l: ImportLimits): string | null {
  if (files.length > l.files) return `Choose at most ${l.files} files for one import.`;
  const total = files.reduce((a, f) => a + f.size, 0);
  if (total > l.totalMb * MB)
    return `Together these files are ${fileSize(total)}; one import takes up to ${l.totalMb} MB.`;
  return null;
}

/** How far an import has come, in the words its list shows (the page renders it; the browser keeps it current). */
export function importProgress(i: { state: string; done: number; total: number }): string {
  return i.state === 'done' ? 'finished' : `${i.done} of ${i.total} done`;
}
