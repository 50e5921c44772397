// The history page's view of a record: every version with who, when, its change note and its status, and any
// version compared with the one before it, word by word. Reads record_revisions directly.
import { asc, eq } from 'drizzle-orm';
import { db } from '../db/client';
import { recordRevisions, users } from '../db/schema';
import { diffDocs, diffTitles, type DocDiff, type Piece } from '../../record-diff';
import type { RecordStatus } from '../../domain';

export interface HistoryVersion {
  version: number;
  createdAt: string;
  editor: string;
  title: string;
  status: RecordStatus;
  /** What the editor wrote about the change; notes the app wrote itself for a status change are left out. */
  changeNote: string | null;
  /** Set when this version changed the status. */
  statusChange: { from: RecordStatus; to: RecordStatus } | null;
  titleChanged: boolean;
  /** Words added and removed against the version before (null for the first). */
  words: { inserted: number; deleted: number; marks: number } | null;
}

export interface VersionComparison {
  version: HistoryVersion;
  previous: HistoryVersion | null;
  diff: DocDiff;
  title: Piece[];
}

export interface RecordHistory {
  /** Oldest first. */
  versions: HistoryVersion[];
  selected: VersionComparison;
}

const AUTO_STATUS_NOTE = /^Status: \S+ → \S+$/;

/** The history of a record that exists; `pick` chooses the version to open (default: the newest). */
export function recordHistory(recordId: string, pick?: number): RecordHistory | null {
  const rows = db()
    .select({
      version: recordRevisions.version,
      title: recordRevisions.title,
      status: recordRevisions.status,
      body: recordRevisions.body,
      note: recordRevisions.note,
      createdAt: recordRevisions.createdAt,
      editor: users.name,
    })
    .from(recordRevisions)
    .leftJoin(users, eq(users.id, recordRevisions.editorId))
    .where(eq(recordRevisions.recordId, recordId))
    .orderBy(asc(recordRevisions.version))
    .all();
  if (rows.length === 0) return null;
  const diffs = rows.map((r, i) => (i === 0 ? null : diffDocs(rows[i - 1].body, r.body)));
  const versions: HistoryVersion[] = rows.map((r, i) => {
    const prev = i > 0 ? rows[i - 1] : null;
    const statusChange = prev && prev.status !== r.status ? { from: prev.status, to: r.status } : null;
    const note = r.note?.trim() || null;
    const d = diffs[i];
    return {
      version: r.version,
      createdAt: r.createdAt.toISOString(),
      editor: r.editor ?? 'former member',
      title: r.title,
      status: r.status,
      changeNote: note && statusChange && AUTO_STATUS_NOTE.test(note) ? null : note,
      statusChange,
      titleChanged: !!prev && prev.title !== r.title,
      words: d ? { inserted: d.stats.insertedWords, deleted: d.stats.deletedWords, marks: d.stats.markChanges } : null,
    };
  });
  const picked = rows.findIndex((r) => r.version === pick);
  const index = picked === -1 ? rows.length - 1 : picked;
  const row = rows[index];
  const prev = index > 0 ? rows[index - 1] : null;
  return {
    versions,
    selected: {
      version: versions[index],
      previous: prev ? versions[index - 1] : null,
      // The first version has nothing before it: it is compared with itself, so its text shows once, unchanged.
      diff: diffs[index] ?? diffDocs(row.body, row.body),
      title: prev ? diffTitles(prev.title, row.title) : [{ text: row.title, marks: [], op: 'same' }],
    },
  };
}
