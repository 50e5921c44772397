// Converts imported files into draft records, one file at a time, off the request path. The queue lives in this
// process (p-queue, concurrency 1): the files wait in the database (`import_items` in state `queued`), so a restart
// loses nothing and `resumeImports()` picks them up again. One file at a time keeps the same-bytes check exact and
// leaves the second core to the people using the site; every file yields to the event loop before it starts.
import PQueue from 'p-queue';
import { and, asc, eq, isNull, ne, sql } from 'drizzle-orm';
import { readFile } from 'node:fs/promises';
import type { JSONContent } from '@tiptap/core';
import { db } from '../db/client';
import { attachments, importItems, imports, records, seasons, users } from '../db/schema';
import { HttpError } from '../http';
import { newId } from '../ids';
import { recordAudit } from '../audit';
import { currentSeason } from '../seasons';
import { pathForHash, storeBytes } from '../storage';
import { sniffType } from '../filetype';
import { cleanName } from '../records/attachments';
import { createRecord } from '../records/write';
import { recordCreateSchema } from '../../schemas/records';
import { can } from '../../policy';
import { baseName, convertFile, extensionOf, ImportProblem } from './convert';

const queue = new PQueue({ concurrency: 1 });
/** The longest one file may take to convert. */
const FILE_SECONDS = 60;

/**
 * Dates the files inside a zip carry (the zip's own entry dates), kept only while the file waits: the tables have no
 * column for them, so after a restart such a file goes by its document's own date or the current season.
 */
const entryDates = new Map<string, Date>();

export function enqueueItems(items: { id: string; fileDate?: Date | null }[]): void {
  for (const item of items) {
    if (item.fileDate) entryDates.set(item.id, item.fileDate);
    void queue.add(() => runItem(item.id));
  }
}

/** Puts every file still waiting back in the queue (at start: an import cut off by a restart goes on). */
export function resumeImports(): number {
  const waiting = db()
    .select({ id: importItems.id })
    .from(importItems)
    .innerJoin(imports, eq(imports.id, importItems.importId))
    .where(and(eq(importItems.state, 'queued'), ne(imports.state, 'done')))
    .orderBy(asc(imports.createdAt), asc(importItems.position))
    .all();
  enqueueItems(waiting);
  return waiting.length;
}

/** Resolves when every file queued so far has been converted (tests and the benchmark wait on it). */
export function importsSettled(): Promise<void> {
  return queue.onIdle();
}

const CONTENT_TYPES: Record<string, string> = {
  docx: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  md: 'text/markdown',
  markdown: 'text/markdown',
  html: 'text/html',
  htm: 'text/html',
  txt: 'text/plain',
  pdf: 'application/pdf',
};

type Finish = { state: 'done' | 'skipped' | 'failed'; message: string | null; recordId: string | null };

async function runItem(itemId: string): Promise<void> {
  // Lets waiting requests in before a file that may take a while.
  await new Promise((r) => setImmediate(r));
  const row = db()
    .select({ item: importItems, imp: imports })
    .from(importItems)
    .innerJoin(imports, eq(imports.id, importItems.importId))
    .where(eq(importItems.id, itemId))
    .get();
  if (!row || row.item.state !== 'queued') return;
  if (row.imp.state === 'queued')
    db().update(imports).set({ state: 'running' }).where(eq(imports.id, row.imp.id)).run();
  let finish: Finish;
  let timer: NodeJS.Timeout | undefined;
  const clock = { timedOut: false };
  try {
    // A file that takes unreasonably long (a crafted PDF, say) fails instead of holding up every import behind it.
    const tooSlow = new Promise<never>((_, reject) => {
      timer = setTimeout(() => {
        clock.timedOut = true;
        reject(new ImportProblem(`reading it took over ${FILE_SECONDS} seconds, so it was given up.`));
      }, FILE_SECONDS * 1000);
    });
    finish = await Promise.race([convertItem(row.item, row.imp, clock), tooSlow]);
  } catch (e) {
    finish = { state: 'failed', message: failureMessage(row.item.fileName, e), recordId: null };
    if (!(e instanceof ImportProblem) && !(e instanceof HttpError))
      console.error(`[wakebook] import of ${row.item.fileName} failed:`, e);
  }
  clearTimeout(timer);
  entryDates.delete(itemId);
  finishItem(row.item.id, row.imp.id, finish);
}

function failureMessage(fileName: string, e: unknown): string {
  if (e instanceof ImportProblem) return `${fileName} was not imported: ${e.message}`;
  if (e instanceof HttpError) {
    const detail = e.issues.map((i) => i.message).join(' ');
    return `${fileName} was not imported: ${detail || e.message}`;
  }
  return `${fileName} was not imported: something went wrong while reading it.`;
}

/** Marks one file finished and, with the last one, the import. */
export function finishItem(itemId: string, importId: string, f: Finish): void {
  const now = new Date();
  db().transaction((tx) => {
    tx.update(importItems)
      .set({ state: f.state, message: f.message, recordId: f.recordId, finishedAt: now })
      .where(and(eq(importItems.id, itemId), eq(importItems.state, 'queued')))
      .run();
    tx.update(imports)
      .set({ done: sql`(select count(*) from import_items where import_id = ${importId} and state != 'queued')` })
      .where(eq(imports.id, importId))
      .run();
    const left = tx
      .select({ n: sql<number>`count(*)` })
      .from(importItems)
      .where(and(eq(importItems.importId, importId), eq(importItems.state, 'queued')))
      .get()!.n;
    if (left === 0) tx.update(imports).set({ state: 'done', finishedAt: now }).where(eq(imports.id, importId)).run();
  });
}

/** The live record that already holds these bytes (as its original or any attachment), if any. */
function holderOf(sha256: string): { id: string; title: string } | null {
  return (
    db()
      .select({ id: records.id, title: records.title })
      .from(attachments)
      .innerJoin(records, eq(records.id, attachments.recordId))
      .where(and(eq(attachments.sha256, sha256), isNull(records.deletedAt)))
      .limit(1)
      .get() ?? null
  );
}

function seasonForDate(date: Date | null): { id: string; current: boolean } | null {
  if (!date) return null;
  const day = date.toISOString().slice(0, 10);
  const s = db()
    .select({ id: seasons.id, current: seasons.isCurrent })
    .from(seasons)
    .where(and(sql`${seasons.startsOn} <= ${day}`, sql`${seasons.endsOn} >= ${day}`))
    .orderBy(asc(seasons.startsOn))
    .get();
  return s ?? null;
}

/** A title of 3 to 200 characters of one line: the document's, else the file's name. */
function titleFor(found: string | null, fileName: string): string {
  const clean = (s: string) =>
    s
      .replace(/[\u0000-\u001f\u007f]/g, ' ')
      .replace(/\s+/g, ' ')
      .trim();
  let title = clean(found ?? '');
  if (title.length < 3) title = clean(baseName(fileName));
  if (title.length < 3) title = `Imported ${clean(fileName)}`.trim();
  return Array.from(title).slice(0, 200).join('').trim();
}

/**
 * Replaces images and links to images that were not kept with their words (nothing points at an attachment that
 * does not exist): an image becomes a paragraph of its description, or nothing when it has none.
 */
function unlink(n: JSONContent, dropped: Set<string>): JSONContent | null {
  if (n.type === 'image' && dropped.has(String(n.attrs?.src))) {
    const alt = typeof n.attrs?.alt === 'string' ? n.attrs.alt : '';
    return alt ? { type: 'paragraph', content: [{ type: 'text', text: `[image: ${alt}]` }] } : null;
  }
  const out: JSONContent = { ...n };
  if (n.marks) out.marks = n.marks.filter((m) => !(m.type === 'link' && dropped.has(String(m.attrs?.href))));
  if (n.content) out.content = n.content.map((c) => unlink(c, dropped)).filter((c): c is JSONContent => c !== null);
  return out;
}

async function convertItem(
  item: typeof importItems.$inferSelect,
  imp: typeof imports.$inferSelect,
  clock: { timedOut: boolean },
): Promise<Finish> {
  const user = imp.userId ? db().select().from(users).where(eq(users.id, imp.userId)).get() : undefined;
  if (!user)
    return {
      state: 'failed',
      message: `${item.fileName} was not imported: the person who started it is no longer on the team.`,
      recordId: null,
    };
  const actor = { id: user.id, email: user.email, role: user.role };
  const holder = holderOf(item.sha256);
  if (holder)
    return {
      state: 'skipped',
      message: `${item.fileName} was imported before: “${holder.title}” already holds the same file.`,
      recordId: holder.id,
    };
  let bytes: Buffer;
  try {
    bytes = await readFile(pathForHash(item.sha256));
  } catch {
    throw new ImportProblem('its stored copy is missing; import it again.');
  }
  const imageIds: string[] = [];
  const link = (i: number) => {
    imageIds[i] ??= newId();
    return `/api/attachments/${imageIds[i]}`;
  };
  const converted = await convertFile(bytes, item.fileName, link);

  // The season: the one chosen, else the one the file's own date falls in, else the current one. A member writes
  // into the current season only, so a date in a past season leaves a member's file in the current one.
  const current = currentSeason();
  let seasonId = imp.seasonId;
  if (!seasonId) {
    const dated = seasonForDate(converted.date ?? entryDates.get(item.id) ?? null);
    seasonId =
      dated && can(actor, 'record:import', { seasonIsCurrent: dated.current }) ? dated.id : (current?.id ?? null);
  }
  if (!seasonId) throw new ImportProblem('no season is current; a lead opens one first.');

  // Images: stored by their bytes, kept only when they really are a picture a browser shows.
  const kept: { id: string; name: string; contentType: string; sha256: string; size: number }[] = [];
  const dropped = new Set<string>();
  for (const [i, image] of converted.images.entries()) {
    const id = imageIds[i];
    if (!id) continue;
    const type = await sniffType(image.bytes, image.name);
    if (type?.kind !== 'image') {
      dropped.add(`/api/attachments/${id}`);
      continue;
    }
    const stored = storeBytes(image.bytes);
    kept.push({ id, name: cleanName(image.name), contentType: type.contentType, ...stored });
  }
  const doc = dropped.size ? (unlink(converted.doc, dropped) ?? converted.doc) : converted.doc;

  const input = recordCreateSchema.parse({
    kind: imp.kind,
    title: titleFor(converted.title, item.fileName),
    subsystem: imp.subsystemSlug,
    seasonId,
    status: 'draft',
    body: doc,
  });
  // Lessons have no draft status: they start open, as typed ones do.
  if (imp.kind === 'lesson') delete input.status;
  // Given up meanwhile (the file is already marked failed): write nothing.
  if (clock.timedOut) return { state: 'failed', message: null, recordId: null };
  const record = createRecord(input, actor, { imageAttachmentIds: kept.map((k) => k.id) });
  const now = new Date();
  const base = baseName(item.fileName);
  db().transaction((tx) => {
    for (const a of kept)
      tx.insert(attachments)
        .values({
          id: a.id,
          recordId: record.id,
          fileName: `${cleanName(base)}-${a.name}`,
          contentType: a.contentType,
          size: a.size,
          sha256: a.sha256,
          uploadedById: actor.id,
          createdAt: now,
        })
        .run();
    tx.insert(attachments)
      .values({
        id: newId(),
        recordId: record.id,
        fileName: cleanName(item.fileName.split('/').pop() ?? item.fileName),
        contentType: CONTENT_TYPES[extensionOf(item.fileName)] ?? 'application/octet-stream',
        size: item.size,
        sha256: item.sha256,
        uploadedById: actor.id,
        createdAt: now,
      })
      .run();
  });
  recordAudit({
    actor,
    action: 'record.import',
    targetType: 'record',
    targetId: record.id,
    detail: { import: imp.id, fileName: item.fileName, images: kept.length },
  });
  return { state: 'done', message: null, recordId: record.id };
}
