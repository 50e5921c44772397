import { and, asc, count, desc, eq, isNull, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { LessonSource, RecordKind, RecordStatus } from '../../domain';
import { db, prepared } from '../db/client';
import {
  attachments,
  calculations,
  comments,
  recordCalculations,
  recordLinks,
  recordRevisions,
  records,
  seasons,
  subsystems,
  users,
} from '../db/schema';

const author = alias(users, 'author');
const editor = alias(users, 'editor');
const reviewer = alias(users, 'reviewer');

export interface RecordRef {
  id: string;
  title: string;
  kind: string;
  status: string;
  season: string;
  url: string;
}

export interface AttachmentView {
  id: string;
  fileName: string;
  contentType: string;
  size: number;
  createdAt: string;
  url: string;
  isImage: boolean;
  isCsv: boolean;
}

export interface RecordView {
  id: string;
  kind: RecordKind;
  title: string;
  status: RecordStatus;
  source: LessonSource | null;
  subsystem: string;
  subsystemName: string;
  seasonId: string;
  season: string;
  seasonIsCurrent: boolean;
  author: { id: string; name: string } | null;
  updatedBy: { id: string; name: string } | null;
  version: number;
  body: unknown;
  bodyHtml: string;
  createdAt: string;
  updatedAt: string;
  reviewed: { by: string; at: string; version: number; note: string | null; current: boolean } | null;
  calculations: { id: string; title: string; kind: string; url: string }[];
  related: RecordRef[];
  supersedes: RecordRef[];
  supersededBy: RecordRef[];
  attachments: AttachmentView[];
  commentCount: number;
  url: string;
}

export function attachmentView(a: typeof attachments.$inferSelect): AttachmentView {
  return {
    id: a.id,
    fileName: a.fileName,
    contentType: a.contentType,
    size: a.size,
    createdAt: a.createdAt.toISOString(),
    url: `/api/attachments/${a.id}`,
    isImage: a.contentType.startsWith('image/'),
    isCsv: a.contentType === 'text/csv',
  };
}

const byId = sql.placeholder('id');

/**
 * The record's own row with the names it shows, selected column by column: the stored plain text (search's copy)
 * is never read here, and a flat row maps faster than a nested one. Prepared once, like every statement here.
 */
function recordRowQuery() {
  return prepared('record.row', (d) =>
    d
      .select({
        id: records.id,
        kind: records.kind,
        title: records.title,
        status: records.status,
        source: records.source,
        subsystem: records.subsystemSlug,
        seasonId: records.seasonId,
        authorId: records.authorId,
        updatedById: records.updatedById,
        version: records.version,
        body: records.body,
        bodyHtml: records.bodyHtml,
        createdAt: records.createdAt,
        updatedAt: records.updatedAt,
        reviewedAt: records.reviewedAt,
        reviewedVersion: records.reviewedVersion,
        reviewNote: records.reviewNote,
        subsystemName: subsystems.name,
        season: seasons.name,
        seasonIsCurrent: seasons.isCurrent,
        authorName: author.name,
        editorName: editor.name,
        reviewerName: reviewer.name,
      })
      .from(records)
      .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
      .innerJoin(seasons, eq(seasons.id, records.seasonId))
      .leftJoin(author, eq(author.id, records.authorId))
      .leftJoin(editor, eq(editor.id, records.updatedById))
      .leftJoin(reviewer, eq(reviewer.id, records.reviewedById))
      .where(and(eq(records.id, byId), isNull(records.deletedAt)))
      .prepare(),
  );
}

const other = alias(records, 'other');

/**
 * Every link of the record in either direction together with the (not deleted) record at its other end, in one
 * statement: `outgoing` says whether the link starts at this record.
 */
function linkedQuery() {
  return prepared('record.linked', (d) =>
    d
      .select({
        kind: recordLinks.kind,
        outgoing: sql<number>`${recordLinks.fromRecordId} = ${byId}`,
        id: other.id,
        title: other.title,
        otherKind: other.kind,
        status: other.status,
        season: seasons.name,
      })
      .from(recordLinks)
      .innerJoin(
        other,
        eq(
          other.id,
          sql`case when ${recordLinks.fromRecordId} = ${byId} then ${recordLinks.toRecordId} else ${recordLinks.fromRecordId} end`,
        ),
      )
      .innerJoin(seasons, eq(seasons.id, other.seasonId))
      .where(
        and(
          or(eq(recordLinks.fromRecordId, byId), eq(recordLinks.toRecordId, byId)),
          sql`${other.id} <> ${byId}`,
          isNull(other.deletedAt),
        ),
      )
      .orderBy(asc(other.id))
      .prepare(),
  );
}

export function getRecordView(id: string): RecordView | null {
  const r = recordRowQuery().get({ id });
  if (!r) return null;
  const related: RecordRef[] = [];
  const supersedes: RecordRef[] = [];
  const supersededBy: RecordRef[] = [];
  const seen = new Set<string>();
  for (const l of linkedQuery().all({ id })) {
    const list =
      l.kind === 'related' ? related : l.kind !== 'supersedes' ? null : l.outgoing ? supersedes : supersededBy;
    const key = `${l.kind}.${l.kind === 'related' ? '' : l.outgoing}.${l.id}`;
    if (!list || seen.has(key)) continue;
    seen.add(key);
    list.push({
      id: l.id,
      title: l.title,
      kind: l.otherKind,
      status: l.status,
      season: l.season,
      url: `/records/${l.id}`,
    });
  }
  const calcs = prepared('record.calcs', (d) =>
    d
      .select({ id: calculations.id, title: calculations.title, kind: calculations.kind })
      .from(recordCalculations)
      .innerJoin(calculations, eq(calculations.id, recordCalculations.calculationId))
      .where(and(eq(recordCalculations.recordId, byId), isNull(calculations.deletedAt)))
      .orderBy(asc(calculations.title))
      .prepare(),
  ).all({ id });
  const files = prepared('record.files', (d) =>
    d.select().from(attachments).where(eq(attachments.recordId, byId)).orderBy(asc(attachments.createdAt)).prepare(),
  ).all({ id });
  const commentCount =
    prepared('record.commentCount', (d) =>
      d.select({ n: count() }).from(comments).where(eq(comments.recordId, byId)).prepare(),
    ).get({ id })?.n ?? 0;
  return {
    id: r.id,
    kind: r.kind,
    title: r.title,
    status: r.status,
    source: r.source,
    subsystem: r.subsystem,
    subsystemName: r.subsystemName,
    seasonId: r.seasonId,
    season: r.season,
    seasonIsCurrent: r.seasonIsCurrent,
    author: r.authorId && r.authorName ? { id: r.authorId, name: r.authorName } : null,
    updatedBy: r.updatedById && r.editorName ? { id: r.updatedById, name: r.editorName } : null,
    version: r.version,
    body: r.body,
    bodyHtml: r.bodyHtml,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    reviewed:
      r.reviewedAt && r.reviewerName
        ? {
            by: r.reviewerName,
            at: r.reviewedAt.toISOString(),
            version: r.reviewedVersion ?? 0,
            note: r.reviewNote,
            current: r.reviewedVersion === r.version,
          }
        : null,
    calculations: calcs.map((c) => ({ ...c, url: `/calculations/${c.id}` })),
    related,
    supersedes,
    supersededBy,
    attachments: files.map(attachmentView),
    commentCount,
    url: `/records/${r.id}`,
  };
}

export function listRevisions(recordId: string) {
  return db()
    .select({
      id: recordRevisions.id,
      version: recordRevisions.version,
      title: recordRevisions.title,
      status: recordRevisions.status,
      changeNote: recordRevisions.note,
      createdAt: recordRevisions.createdAt,
      editor: users.name,
      body: recordRevisions.body,
      bodyText: recordRevisions.bodyText,
    })
    .from(recordRevisions)
    .leftJoin(users, eq(users.id, recordRevisions.editorId))
    .where(eq(recordRevisions.recordId, recordId))
    .orderBy(desc(recordRevisions.version))
    .all()
    .map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), editor: r.editor ?? 'former member' }));
}

/** Whether a record exists (and is not deleted), without loading it. */
export function recordExists(id: string): boolean {
  return !!prepared('record.exists', (d) =>
    d
      .select({ id: records.id })
      .from(records)
      .where(and(eq(records.id, byId), isNull(records.deletedAt)))
      .prepare(),
  ).get({ id });
}
