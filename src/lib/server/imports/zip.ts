// Reading zips with yauzl: the central directory is checked before a single byte is inflated (entry count, the sizes
// the entries declare, how much each is compressed), and yauzl itself refuses an entry that inflates past the size it
// declared. So a zip bomb is refused before it can fill the disk or the memory.
import yauzl from 'yauzl';
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { discardIncoming, incomingPath } from '../storage';

export interface ZipLimits {
  /** Entries in the central directory, folders and hidden files included. */
  maxEntries: number;
  /** What all entries may add up to once unzipped. */
  maxTotalBytes: number;
  /** How many times smaller than its unzipped size an entry of more than RATIO_FLOOR bytes may be. */
  maxRatio: number;
}

/** Below this unzipped size an entry may be compressed as much as it likes: it cannot hurt. */
const RATIO_FLOOR = 1024 * 1024;
export const MAX_RATIO = 200;

/** A zip whose directory promises more than the limits: the whole request is refused. */
export class ZipTooLarge extends Error {}
/** Not a zip, or a broken one. */
export class ZipUnreadable extends Error {}

export interface ZipEntryInfo {
  name: string;
  size: number;
  isFolder: boolean;
  encrypted: boolean;
  modified: Date | null;
}

function mb(n: number) {
  return `${Math.round(n / 1024 / 1024)} MB`;
}

function open(source: string | Buffer): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) => {
    const done = (err: Error | null, zip?: yauzl.ZipFile) =>
      err || !zip ? reject(new ZipUnreadable(err?.message ?? 'not a zip')) : resolve(zip);
    const options = { lazyEntries: true, autoClose: false, strictFileNames: false, validateEntrySizes: true };
    if (typeof source === 'string') yauzl.open(source, options, done);
    else yauzl.fromBuffer(source, options, done);
  });
}

/** Walks the central directory only (nothing is inflated) and checks it against the limits. */
async function readDirectory(zip: yauzl.ZipFile, limits: ZipLimits): Promise<Map<ZipEntryInfo, yauzl.Entry>> {
  if (zip.entryCount > limits.maxEntries)
    throw new ZipTooLarge(`it lists ${zip.entryCount} entries; at most ${limits.maxEntries} are read`);
  const out = new Map<ZipEntryInfo, yauzl.Entry>();
  let total = 0;
  await new Promise<void>((resolve, reject) => {
    zip.on('entry', (entry: yauzl.Entry) => {
      const isFolder = entry.fileName.endsWith('/');
      total += entry.uncompressedSize;
      if (total > limits.maxTotalBytes)
        return reject(new ZipTooLarge(`its files come to over ${mb(limits.maxTotalBytes)} unzipped`));
      if (
        entry.uncompressedSize > RATIO_FLOOR &&
        entry.uncompressedSize > limits.maxRatio * Math.max(1, entry.compressedSize)
      )
        return reject(
          new ZipTooLarge(
            `${entry.fileName} is compressed more than ${limits.maxRatio} to 1, which documents never are (a zip bomb)`,
          ),
        );
      let modified: Date | null = null;
      try {
        modified = entry.getLastModDate();
      } catch {
        modified = null;
      }
      out.set(
        {
          name: entry.fileName,
          size: entry.uncompressedSize,
          isFolder,
          encrypted: entry.isEncrypted(),
          modified: modified && !Number.isNaN(modified.getTime()) ? modified : null,
        },
        entry,
      );
      zip.readEntry();
    });
    zip.once('end', () => resolve());
    zip.once('error', (e: Error) => reject(new ZipUnreadable(e.message)));
    zip.readEntry();
  });
  return out;
}

function streamOf(zip: yauzl.ZipFile, entry: yauzl.Entry) {
  return new Promise<NodeJS.ReadableStream>((resolve, reject) =>
    zip.openReadStream(entry, (err, stream) =>
      err || !stream ? reject(new ZipUnreadable(err?.message ?? 'unreadable entry')) : resolve(stream),
    ),
  );
}

/** A zip opened and checked: its entries, and a way to write one out to a temporary file. */
export interface OpenedZip {
  entries: ZipEntryInfo[];
  /** Writes an entry to a new temporary file, hashing it on the way. */
  extract(entry: ZipEntryInfo): Promise<{ path: string; size: number; sha256: string }>;
  /** Reads a small entry into memory. */
  read(entry: ZipEntryInfo): Promise<Buffer>;
  close(): void;
}

export async function openZip(source: string | Buffer, limits: ZipLimits): Promise<OpenedZip> {
  const zip = await open(source);
  let byInfo: Map<ZipEntryInfo, yauzl.Entry>;
  try {
    byInfo = await readDirectory(zip, limits);
  } catch (e) {
    zip.close();
    throw e;
  }
  return {
    entries: [...byInfo.keys()],
    async extract(info) {
      const stream = await streamOf(zip, byInfo.get(info)!);
      const path = incomingPath();
      const hash = createHash('sha256');
      let size = 0;
      const tap = new Transform({
        transform(chunk: Buffer, _e, done) {
          hash.update(chunk);
          size += chunk.byteLength;
          done(null, chunk);
        },
      });
      try {
        await pipeline(stream, tap, createWriteStream(path, { flags: 'wx' }));
      } catch (e) {
        discardIncoming(path);
        throw new ZipUnreadable(e instanceof Error ? e.message : 'unreadable entry');
      }
      return { path, size, sha256: hash.digest('hex') };
    },
    async read(info) {
      const stream = await streamOf(zip, byInfo.get(info)!);
      const chunks: Buffer[] = [];
      try {
        for await (const c of stream) chunks.push(c as Buffer);
      } catch (e) {
        throw new ZipUnreadable(e instanceof Error ? e.message : 'unreadable entry');
      }
      return Buffer.concat(chunks);
    },
    close: () => zip.close(),
  };
}

/** Folders, hidden files and what operating systems leave in zips (__MACOSX, .DS_Store, Thumbs.db) are not documents. */
export function isSystemEntry(name: string): boolean {
  const parts = name.split('/').filter(Boolean);
  return (
    name.endsWith('/') ||
    parts.some((p) => p.startsWith('.') || p === '__MACOSX') ||
    /^(thumbs\.db|desktop\.ini)$/i.test(parts[parts.length - 1] ?? '')
  );
}
