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

/**
 * The records that ids name, in one statement prepared once: the ids travel as one JSON array parameter, so a
 * different number of links does not build and prepare new SQL on every read.
 */
function refs(ids: string[]): Map<string, RecordRef> {
  if (ids.length === 0) return new Map();
  const rows = prepared('record.refs', (d) =>
    d
      .select({
        id: records.id,
        title: records.title,
        kind: records.kind,
        status: records.status,
        season: seasons.name,
      })
      .from(records)
      .innerJoin(seasons, eq(seasons.id, records.seasonId))
      .where(
        and(sql`${records.id} in (select value from json_each(${sql.placeholder('ids')}))`, isNull(records.deletedAt)),
      )
      .prepare(),
  ).all({ ids: JSON.stringify(ids) });
  return new Map(rows.map((r) => [r.id, { ...r, url: `/records/${r.id}` }]));
}

const byId = sql.placeholder('id');

function recordRowQuery() {
  return prepared('record.row', (d) =>
    d
      .select({
        r: records,
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

export function getRecordView(id: string): RecordView | null {
  const row = recordRowQuery().get({ id });
  if (!row) return null;
  const r = row.r;
  const links = prepared('record.links', (d) =>
    d
      .select()
      .from(recordLinks)
      .where(or(eq(recordLinks.fromRecordId, byId), eq(recordLinks.toRecordId, byId)))
      .prepare(),
  ).all({ id });
  const linked = refs([...new Set(links.flatMap((l) => [l.fromRecordId, l.toRecordId]).filter((x) => x !== id))]);
  const pick = (pred: (l: (typeof links)[number]) => boolean, other: (l: (typeof links)[number]) => string) =>
    [...new Set(links.filter(pred).map(other))].map((x) => linked.get(x)).filter((x): x is RecordRef => !!x);
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
    subsystem: r.subsystemSlug,
    subsystemName: row.subsystemName,
    seasonId: r.seasonId,
    season: row.season,
    seasonIsCurrent: row.seasonIsCurrent,
    author: r.authorId && row.authorName ? { id: r.authorId, name: row.authorName } : null,
    updatedBy: r.updatedById && row.editorName ? { id: r.updatedById, name: row.editorName } : null,
    version: r.version,
    body: r.body,
    bodyHtml: r.bodyHtml,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    reviewed:
      r.reviewedAt && row.reviewerName
        ? {
            by: row.reviewerName,
            at: r.reviewedAt.toISOString(),
            version: r.reviewedVersion ?? 0,
            note: r.reviewNote,
            current: r.reviewedVersion === r.version,
          }
        : null,
    calculations: calcs.map((c) => ({ ...c, url: `/calculations/${c.id}` })),
    related: pick(
      (l) => l.kind === 'related',
      (l) => (l.fromRecordId === id ? l.toRecordId : l.fromRecordId),
    ),
    supersedes: pick(
      (l) => l.kind === 'supersedes' && l.fromRecordId === id,
      (l) => l.toRecordId,
    ),
    supersededBy: pick(
      (l) => l.kind === 'supersedes' && l.toRecordId === id,
      (l) => l.fromRecordId,
    ),
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

/** One comment as listComments() shows it. */
export function getComment(commentId: string) {
  const c = prepared('record.comment', (d) =>
    d
      .select({
        id: comments.id,
        body: comments.body,
        parentId: comments.parentId,
        createdAt: comments.createdAt,
        authorId: comments.authorId,
        author: users.name,
        authorRole: users.role,
      })
      .from(comments)
      .leftJoin(users, eq(users.id, comments.authorId))
      .where(eq(comments.id, byId))
      .prepare(),
  ).get({ id: commentId });
  return c && { ...c, createdAt: c.createdAt.toISOString(), author: c.author ?? 'former member' };
}

export function listComments(recordId: string) {
  return prepared('record.comments', (d) =>
    d
      .select({
        id: comments.id,
        body: comments.body,
        parentId: comments.parentId,
        createdAt: comments.createdAt,
        authorId: comments.authorId,
        author: users.name,
        authorRole: users.role,
      })
      .from(comments)
      .leftJoin(users, eq(users.id, comments.authorId))
      .where(eq(comments.recordId, byId))
      .orderBy(asc(comments.createdAt), asc(comments.id))
      .prepare(),
  )
    .all({ id: recordId })
    .map((c) => ({ ...c, createdAt: c.createdAt.toISOString(), author: c.author ?? 'former member' }));
}

/** The newest questions and answers across all records, for the home page. */
export function recentComments(limit: number) {
  return prepared('record.recentComments', (d) =>
    d
      .select({
        id: comments.id,
        body: comments.body,
        createdAt: comments.createdAt,
        author: users.name,
        recordId: records.id,
        recordTitle: records.title,
      })
      .from(comments)
      .innerJoin(records, eq(records.id, comments.recordId))
      .leftJoin(users, eq(users.id, comments.authorId))
      .where(isNull(records.deletedAt))
      .orderBy(desc(comments.createdAt))
      .limit(sql.placeholder('limit'))
      .prepare(),
  )
    .all({ limit })
    .map((c) => ({ ...c, createdAt: c.createdAt.toISOString(), author: c.author ?? 'former member' }));
}
