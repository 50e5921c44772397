import { createReadStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { db } from './db/client';

/**
 * A consistent copy of the live database through SQLite's online backup (better-sqlite3's `backup()`): readers
 * and writers carry on while it runs, and the copy is one point in time. The copy is written to a temporary file,
 * streamed back, and deleted when the stream ends or is cancelled.
 */
export async function databaseBackup(
  now = new Date(),
): Promise<{ stream: ReadableStream<Uint8Array>; size: number; fileName: string }> {
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-backup-'));
  const file = join(dir, 'wakebook.db');
  const cleanup = () => rmSync(dir, { recursive: true, force: true });
  try {
    await db().$client.backup(file);
  } catch (e) {
    cleanup();
    throw e;
  }
  const size = statSync(file).size;
  const reader = createReadStream(file);
  reader.on('close', cleanup);
  const stamp = now.toISOString().slice(0, 16).replace(/[-:]/g, '').replace('T', '-');
  return {
    stream: Readable.toWeb(reader) as ReadableStream<Uint8Array>,
    size,
    fileName: `wakebook-backup-${stamp}.db`,
  };
}
