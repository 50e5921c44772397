// What a file is, told from its bytes (not its name): the allowed kinds of attachment. Binary formats are
// recognised by `file-type`; it does not tell text apart, so text and CSV are told by a UTF-8 check of our own.
import { fileTypeFromBuffer } from 'file-type';

export type Sniffed = { contentType: string; kind: 'image' | 'pdf' | 'csv' | 'text' } | null;

const BINARY: Record<string, NonNullable<Sniffed>> = {
  'image/png': { contentType: 'image/png', kind: 'image' },
  // An animated PNG is a PNG to every browser; it is stored and served as one.
  'image/apng': { contentType: 'image/png', kind: 'image' },
  'image/jpeg': { contentType: 'image/jpeg', kind: 'image' },
  'image/gif': { contentType: 'image/gif', kind: 'image' },
  'image/webp': { contentType: 'image/webp', kind: 'image' },
  'application/pdf': { contentType: 'application/pdf', kind: 'pdf' },
};

/** The extensions each allowed type is known by; the first is the one a file of that type is given. */
export const EXTENSIONS: Record<string, readonly string[]> = {
  'image/png': ['png'],
  'image/jpeg': ['jpg', 'jpeg'],
  'image/gif': ['gif'],
  'image/webp': ['webp'],
  'application/pdf': ['pdf'],
  'text/csv': ['csv'],
  'text/plain': ['txt', 'text', 'md', 'log'],
};

// file-type finds every format it knows within its first 4100 bytes; CSV is guessed from the first 4 KiB.
const HEAD_BYTES = 4100;
// Tab, line feed, vertical tab, form feed and carriage return are text; every other control character is not.
const CONTROL = /[\u0000-\u0008\u000e-\u001f\u007f]/;

interface TypeSniffer {
  /** Feeds the next chunk of the file, in order. */
  push(chunk: Uint8Array): void;
  /** The type of everything pushed, or null when it is not an allowed kind. */
  finish(fileName: string): Promise<Sniffed>;
}

/**
 * Sniffs a file chunk by chunk as it streams past, keeping only its head: the text check runs over the whole file
 * (a NUL or broken UTF-8 sequence anywhere makes it binary), so nothing needs the file in memory.
 */
export function startSniffing(): TypeSniffer {
  const head = new Uint8Array(HEAD_BYTES);
  let headLength = 0;
  let total = 0;
  let text = true;
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const checkText = (chunk: Uint8Array | undefined) => {
    if (!text) return;
    try {
      if (CONTROL.test(chunk ? decoder.decode(chunk, { stream: true }) : decoder.decode())) text = false;
    } catch {
      text = false;
    }
  };
  return {
    push(chunk) {
      if (headLength < HEAD_BYTES) {
        const take = chunk.subarray(0, HEAD_BYTES - headLength);
        head.set(take, headLength);
        headLength += take.byteLength;
      }
      total += chunk.byteLength;
      checkText(chunk);
    },
    async finish(fileName) {
      if (total === 0) return null;
      checkText(undefined);
      const start = head.subarray(0, headLength);
      const found = await fileTypeFromBuffer(start);
      if (found && BINARY[found.mime]) return BINARY[found.mime];
      // Text wins over any other verdict: a text file can look like a format that starts with letters (e.g. XML).
      if (!text) return null;
      return /\.csv$/i.test(fileName) || looksLikeCsv(start)
        ? { contentType: 'text/csv', kind: 'csv' }
        : { contentType: 'text/plain', kind: 'text' };
    },
  };
}

/** The type of a file held in memory (small files: the demo attachments, tests). */
export async function sniffType(bytes: Uint8Array, fileName: string): Promise<Sniffed> {
  const sniffer = startSniffing();
  sniffer.push(bytes);
  return sniffer.finish(fileName);
}

function looksLikeCsv(bytes: Uint8Array): boolean {
  const head = new TextDecoder().decode(bytes.subarray(0, 4096)).split(/\r?\n/).filter(Boolean).slice(0, 5);
  if (head.length < 2) return false;
  const commas = head.map((l) => l.split(',').length);
  return commas[0] > 1 && commas.every((c) => c === commas[0]);
}
