import { createHash, randomBytes } from 'node:crypto';
import {
  createReadStream,
  existsSync,
  mkdirSync,
  readdirSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { Readable } from 'node:stream';
import { settings } from './config';

/** Files live under WAKEBOOK_UPLOADS by content hash (ab/abcdef…), so identical uploads share one copy. */
export function pathForHash(sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error('not a sha256');
  return join(resolve(settings().WAKEBOOK_UPLOADS), sha256.slice(0, 2), sha256);
}

export function storeBytes(bytes: Uint8Array): { sha256: string; size: number } {
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const path = pathForHash(sha256);
  if (!existsSync(path)) {
    mkdirSync(dirname(path), { recursive: true });
    // Write then rename, so a crash never leaves a half file under the final name.
    const tmp = `${path}.${process.pid}.${Date.now()}.tmp`;
    writeFileSync(tmp, bytes);
    renameSync(tmp, path);
  }
  return { sha256, size: bytes.byteLength };
}

/**
 * A fresh path for a file still arriving. It is inside the uploads folder (same file system, so the final move is
 * a rename) but in its own folder, where no content hash can point.
 */
export function incomingPath(): string {
  const dir = incomingDir();
  mkdirSync(dir, { recursive: true });
  return join(dir, `${randomBytes(12).toString('hex')}.part`);
}

function incomingDir(): string {
  return join(resolve(settings().WAKEBOOK_UPLOADS), 'incoming');
}

/**
 * Deletes what a stopped process left in `incoming/` (an upload cut off by a crash or a kill): nothing refers to
 * those files. Only files last written before `before` (by default, when this process started) go, so an upload
 * that is still arriving is never touched. Returns how many were removed.
 */
export function removeStaleIncoming(before = performance.timeOrigin): number {
  const dir = incomingDir();
  let removed = 0;
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return 0; // no folder yet: nothing was ever uploaded
  }
  for (const name of names) {
    const path = join(dir, name);
    try {
      const st = statSync(path);
      if (!st.isFile() || st.mtimeMs >= before) continue;
      rmSync(path, { force: true });
      removed++;
    } catch {
      // gone meanwhile, or unreadable: the next start tries again
    }
  }
  return removed;
}

/** Moves a complete incoming file under its hash, or drops it when those bytes are stored already. */
export function keepIncoming(path: string, sha256: string): void {
  const final = pathForHash(sha256);
  if (existsSync(final)) return discardIncoming(path);
  mkdirSync(dirname(final), { recursive: true });
  renameSync(path, final);
}

export function discardIncoming(path: string): void {
  rmSync(path, { force: true });
}

export function openStored(sha256: string): { stream: ReadableStream<Uint8Array>; size: number } | null {
  const path = pathForHash(sha256);
  if (!existsSync(path)) return null;
  return { stream: Readable.toWeb(createReadStream(path)) as ReadableStream<Uint8Array>, size: statSync(path).size };
}
