// What a file is, told from its first bytes (not its name): the allowed kinds of attachment.

export type Sniffed = { contentType: string; kind: 'image' | 'pdf' | 'csv' | 'text' } | null;

const startsWith = (b: Uint8Array, sig: number[], offset = 0) => sig.every((v, i) => b[offset + i] === v);

export function sniffType(bytes: Uint8Array, fileName: string): Sniffed {
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))
    return { contentType: 'image/png', kind: 'image' };
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return { contentType: 'image/jpeg', kind: 'image' };
  if (startsWith(bytes, [0x47, 0x49, 0x46, 0x38]) && (bytes[4] === 0x37 || bytes[4] === 0x39) && bytes[5] === 0x61)
    return { contentType: 'image/gif', kind: 'image' };
  if (startsWith(bytes, [0x52, 0x49, 0x46, 0x46]) && startsWith(bytes, [0x57, 0x45, 0x42, 0x50], 8))
    return { contentType: 'image/webp', kind: 'image' };
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return { contentType: 'application/pdf', kind: 'pdf' };
  if (isPlainText(bytes)) {
    return /\.csv$/i.test(fileName) || looksLikeCsv(bytes)
      ? { contentType: 'text/csv', kind: 'csv' }
      : { contentType: 'text/plain', kind: 'text' };
  }
  return null;
}

/** UTF-8 without NUL or other binary control bytes (tabs, line breaks and form feeds allowed). */
function isPlainText(bytes: Uint8Array): boolean {
  if (bytes.length === 0) return false;
  for (let i = 0; i < Math.min(bytes.length, 1 << 20); i++) {
    const c = bytes[i];
    if (c < 0x09 || (c > 0x0d && c < 0x20) || c === 0x7f) return false;
  }
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

function looksLikeCsv(bytes: Uint8Array): boolean {
  const head = new TextDecoder().decode(bytes.slice(0, 4096)).split(/\r?\n/).filter(Boolean).slice(0, 5);
  if (head.length < 2) return false;
  const commas = head.map((l) => l.split(',').length);
  return commas[0] > 1 && commas.every((c) => c === commas[0]);
}
