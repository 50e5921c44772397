// Importing documents: the request streams the files to storage (a zip is checked and opened into its files), writes
// the import and one item per file, and answers at once; queue.ts converts the files into draft records afterwards.
import { and, asc, desc, eq } from 'drizzle-orm';
import { db } from '../db/client';
import { importItems, imports } from '../db/schema';
import { HttpError, invalidInput, notFound, parseWith } from '../http';
import { newId } from '../ids';
import { recordAudit } from '../audit';
import { settings } from '../config';
import { findSeason, findSubsystem } from '../seasons';
import { receiveFiles } from '../multipart';
import { discardIncoming, keepIncoming } from '../storage';
import { importFieldsSchema } from '../../schemas/imports';
import { can } from '../../policy';
import { IMPORT_EXTENSIONS, type ImportItemState, type ImportState, type RecordKind, type Role } from '../../domain';
import { extensionOf } from './convert';
import { enqueueItems } from './queue';
import { isSystemEntry, MAX_RATIO, openZip, ZipTooLarge, ZipUnreadable } from './zip';

type Actor = { id: string; email: string; role: Role };

export interface ImportItemView {
  id: string;
  fileName: string;
  size: number;
  state: ImportItemState;
  message: string | null;
  recordId: string | null;
  recordUrl: string | null;
}

export interface ImportView {
  id: string;
  state: ImportState;
  total: number;
  done: number;
  subsystem: string;
  kind: RecordKind;
  seasonId: string | null;
  createdAt: string;
  finishedAt: string | null;
  items: ImportItemView[];
}

const MB = 1024 * 1024;

function limits() {
  const s = settings();
  return {
    fileBytes: s.WAKEBOOK_MAX_UPLOAD_MB * MB,
    zipBytes: s.WAKEBOOK_IMPORT_ZIP_MB * MB,
    totalBytes: s.WAKEBOOK_IMPORT_TOTAL_MB * MB,
    files: s.WAKEBOOK_IMPORT_MAX_FILES,
  };
}

const tooLarge = (message: string) => new HttpError(413, 'too_large', message);
const importable = (name: string) => (IMPORT_EXTENSIONS as readonly string[]).includes(extensionOf(name));
const notImportable = (name: string) =>
  `${name} was not imported: only Word (.docx), Markdown, web pages (.html), text, PDF and .zip files are read.`;

function cleanPath(name: string): string {
  return Array.from(name.replace(/\\/g, '/').replace(/[\u0000-\u001f\u007f]/g, '_'))
    .slice(-240)
    .join('')
    .replace(/^\/+/, '');
}

interface PendingItem {
  fileName: string;
  size: number;
  sha256: string;
  state: 'queued' | 'failed';
  message: string | null;
  fileDate: Date | null;
  /** A temporary file still to be kept (moved under its hash) once the whole request is accepted. */
  incoming: string | null;
}

/** Opens an uploaded zip: every document in it becomes an item; a zip bomb refuses the whole request. */
async function expandZip(path: string, zipName: string, out: PendingItem[]): Promise<void> {
  const l = limits();
  let zip;
  try {
    zip = await openZip(path, { maxEntries: 10_000, maxTotalBytes: l.totalBytes, maxRatio: MAX_RATIO });
  } catch (e) {
    if (e instanceof ZipTooLarge) throw tooLarge(`${zipName} was refused: ${e.message}.`);
    out.push(failed(zipName, 0, `${zipName} was not imported: it is not a zip file we can open.`));
    return;
  }
  try {
    for (const entry of zip.entries) {
      if (isSystemEntry(entry.name)) continue;
      // A zipped folder already starts with the folder's name; loose files get the zip's name in front.
      const folder = zipName.replace(/\.zip$/i, '');
      const name = cleanPath(entry.name.startsWith(`${folder}/`) ? entry.name : `${folder}/${entry.name}`);
      if (!importable(entry.name)) out.push(failed(name, entry.size, notImportable(name)));
      else if (extensionOf(entry.name) === 'zip')
        out.push(failed(name, entry.size, `${name} was not imported: a zip inside a zip is not opened.`));
      else if (entry.encrypted)
        out.push(failed(name, entry.size, `${name} was not imported: it is protected by a password.`));
      else if (entry.size > l.fileBytes)
        out.push(
          failed(name, entry.size, `${name} was not imported: it is over ${settings().WAKEBOOK_MAX_UPLOAD_MB} MB.`),
        );
      else {
        try {
          const x = await zip.extract(entry);
          out.push({
            ...x,
            fileName: name,
            state: 'queued',
            message: null,
            fileDate: entry.modified,
            incoming: x.path,
          });
        } catch (e) {
          if (!(e instanceof ZipUnreadable)) throw e;
          out.push(failed(name, entry.size, `${name} was not imported: it is damaged inside the zip.`));
        }
      }
      if (out.length > l.files) throw tooLarge(`An import may hold at most ${l.files} files.`);
    }
  } finally {
    zip.close();
  }
}

function failed(fileName: string, size: number, message: string): PendingItem {
  return { fileName, size, sha256: '', state: 'failed', message, fileDate: null, incoming: null };
}

/**
 * Receives the files of an import, checks the fields and the limits, keeps the bytes and writes the import; the
 * files are converted afterwards. Nothing is kept when the request is refused.
 */
export async function startImport(request: Request, actor: Actor): Promise<ImportView> {
  const l = limits();
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > l.totalBytes + MB)
    throw tooLarge(`An import may send at most ${settings().WAKEBOOK_IMPORT_TOTAL_MB} MB at once.`);
  const received = await receiveFiles(request, {
    field: 'file',
    maxBytes: Math.max(l.fileBytes, l.zipBytes),
    maxBytesFor: (name) => (extensionOf(name) === 'zip' ? l.zipBytes : l.fileBytes),
    maxTotalBytes: l.totalBytes,
    maxFiles: l.files,
    tooLarge: (why, name) =>
      tooLarge(
        why === 'count'
          ? `An import may hold at most ${l.files} files.`
          : why === 'total'
            ? `An import may send at most ${settings().WAKEBOOK_IMPORT_TOTAL_MB} MB at once.`
            : extensionOf(name) === 'zip'
              ? `${name} is over ${settings().WAKEBOOK_IMPORT_ZIP_MB} MB, the largest zip an import takes.`
              : `${name} is over ${settings().WAKEBOOK_MAX_UPLOAD_MB} MB, the largest file an import takes.`,
      ),
    noFile: () =>
      invalidInput([{ path: 'file', message: 'Choose at least one file.' }], 'Send the files in a field named “file”.'),
  });
  const items: PendingItem[] = [];
  try {
    const fields = parseWith(importFieldsSchema, received.fields);
    if (!findSubsystem(fields.subsystem)) throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
    if (fields.seasonId) {
      const season = findSeason(fields.seasonId);
      if (!season) throw invalidInput([{ path: 'seasonId', message: 'No such season.' }]);
      if (!can(actor, 'record:import', { seasonIsCurrent: season.current }))
        throw new HttpError(403, 'forbidden', 'Members import into the current season only.');
    }
    if (received.files.length === 0) throw invalidInput([{ path: 'file', message: 'Choose at least one file.' }]);
    for (const file of received.files) {
      const name = cleanPath(file.fileName) || 'file';
      if (extensionOf(name) === 'zip') {
        await expandZip(file.path, name, items);
        discardIncoming(file.path);
      } else if (!importable(name)) {
        discardIncoming(file.path);
        items.push({ ...failed(name, file.size, notImportable(name)), sha256: file.sha256 });
      } else if (file.size === 0) {
        discardIncoming(file.path);
        items.push({ ...failed(name, 0, `${name} was not imported: it is empty.`), sha256: file.sha256 });
      } else
        items.push({ ...file, fileName: name, state: 'queued', message: null, fileDate: null, incoming: file.path });
      if (items.length > l.files) throw tooLarge(`An import may hold at most ${l.files} files.`);
    }
    if (!items.some((i) => i.state === 'queued')) {
      if (items.length === 0)
        throw invalidInput([{ path: 'file', message: 'The zip holds no documents.' }], 'There was nothing to import.');
      throw new HttpError(
        415,
        'unsupported_type',
        'Nothing here can be imported: send Word (.docx), Markdown, web pages (.html), text, PDF or .zip files.',
      );
    }
    for (const item of items) {
      if (item.incoming) keepIncoming(item.incoming, item.sha256);
      item.incoming = null;
    }
    const id = newId();
    const now = new Date();
    const rows = items.map((item, position) => ({
      id: newId(),
      importId: id,
      position,
      fileName: item.fileName,
      size: item.size,
      sha256: item.sha256,
      state: item.state,
      message: item.message,
      createdAt: now,
      finishedAt: item.state === 'queued' ? null : now,
    }));
    const done = rows.filter((r) => r.state !== 'queued').length;
    db().transaction((tx) => {
      tx.insert(imports)
        .values({
          id,
          userId: actor.id,
          subsystemSlug: fields.subsystem,
          kind: fields.kind,
          seasonId: fields.seasonId ?? null,
          state: 'queued',
          total: rows.length,
          done,
          createdAt: now,
        })
        .run();
      for (const r of rows) tx.insert(importItems).values(r).run();
    });
    recordAudit({
      actor,
      action: 'import.start',
      targetType: 'import',
      targetId: id,
      detail: { files: rows.length, subsystem: fields.subsystem, kind: fields.kind },
    });
    enqueueItems(rows.flatMap((r, i) => (r.state === 'queued' ? [{ id: r.id, fileDate: items[i].fileDate }] : [])));
    return loadImport(id)!;
  } finally {
    for (const f of received.files) discardIncoming(f.path);
    for (const item of items) if (item.incoming) discardIncoming(item.incoming);
  }
}

function loadImport(id: string): ImportView | null {
  const imp = db().select().from(imports).where(eq(imports.id, id)).get();
  if (!imp) return null;
  const items = db()
    .select()
    .from(importItems)
    .where(eq(importItems.importId, id))
    .orderBy(asc(importItems.position))
    .all();
  return {
    ...summary(imp),
    items: items.map((i) => ({
      id: i.id,
      fileName: i.fileName,
      size: i.size,
      state: i.state,
      message: i.message,
      recordId: i.recordId,
      recordUrl: i.recordId ? `/records/${i.recordId}` : null,
    })),
  };
}

function summary(imp: typeof imports.$inferSelect): Omit<ImportView, 'items'> {
  return {
    id: imp.id,
    state: imp.state,
    total: imp.total,
    done: imp.done,
    subsystem: imp.subsystemSlug,
    kind: imp.kind,
    seasonId: imp.seasonId,
    createdAt: imp.createdAt.toISOString(),
    finishedAt: imp.finishedAt ? imp.finishedAt.toISOString() : null,
  };
}

/** One import with its files, for the person who started it or a lead. */
export function getImport(id: string, actor: Actor): ImportView {
  const view = loadImport(id);
  if (!view) throw notFound('That import');
  const owner = db().select({ userId: imports.userId }).from(imports).where(eq(imports.id, id)).get()!.userId;
  if (owner !== actor.id && actor.role !== 'lead')
    throw new HttpError(403, 'forbidden', 'Only the person who started an import (or a lead) may follow it.');
  return view;
}

/** The caller's latest imports, newest first, without their files. */
export function listImports(actor: Actor, limit = 20): Omit<ImportView, 'items'>[] {
  return db()
    .select()
    .from(imports)
    .where(and(eq(imports.userId, actor.id)))
    .orderBy(desc(imports.createdAt))
    .limit(limit)
    .all()
    .map(summary);
}
