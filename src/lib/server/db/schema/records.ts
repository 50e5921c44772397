import { sqliteTable, text, integer, uniqueIndex, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { COMMENT_KINDS, LESSON_SOURCES, RECORD_KINDS, RECORD_LINK_KINDS, RECORD_STATUSES } from '../../../domain';
import { timestamp } from './common';
import { users, seasons, subsystems } from './people';
import { calculations } from './calculations';

/** Decision records and lessons. `version` guards against silent overwrites (optimistic locking). */
export const records = sqliteTable(
  'records',
  {
    id: text().primaryKey(),
    kind: text({ enum: RECORD_KINDS }).notNull(),
    title: text().notNull(),
    subsystemSlug: text()
      .notNull()
      .references(() => subsystems.slug, { onUpdate: 'cascade' }),
    seasonId: text()
      .notNull()
      .references(() => seasons.id),
    status: text({ enum: RECORD_STATUSES }).notNull(),
    /** Lessons only. */
    source: text({ enum: LESSON_SOURCES }),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    body: text({ mode: 'json' }).$type<unknown>().notNull(),
    bodyHtml: text().notNull().default(''),
    bodyText: text().notNull().default(''),
    version: integer().notNull().default(1),
    createdAt: timestamp().notNull(),
    updatedAt: timestamp().notNull(),
    updatedById: text().references(() => users.id, { onDelete: 'set null' }),
    reviewedById: text().references(() => users.id, { onDelete: 'set null' }),
    reviewedAt: timestamp(),
    reviewedVersion: integer(),
    reviewNote: text(),
    deletedAt: timestamp(),
  },
  (t) => [
    index('records_subsystem_season_idx').on(t.subsystemSlug, t.seasonId),
    index('records_kind_status_idx').on(t.kind, t.status),
    index('records_updated_idx').on(t.updatedAt),
  ],
);

/** Every saved version of a record, including the first. */
export const recordRevisions = sqliteTable(
  'record_revisions',
  {
    id: text().primaryKey(),
    recordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    version: integer().notNull(),
    title: text().notNull(),
    status: text({ enum: RECORD_STATUSES }).notNull(),
    body: text({ mode: 'json' }).$type<unknown>().notNull(),
    bodyText: text().notNull().default(''),
    editorId: text().references(() => users.id, { onDelete: 'set null' }),
    note: text(),
    createdAt: timestamp().notNull(),
  },
  (t) => [uniqueIndex('record_revisions_version').on(t.recordId, t.version)],
);

/** Record → record links. `supersedes` runs from the newer record to the one it replaces. */
export const recordLinks = sqliteTable(
  'record_links',
  {
    fromRecordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    toRecordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    kind: text({ enum: RECORD_LINK_KINDS }).notNull(),
    createdAt: timestamp().notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.fromRecordId, t.toRecordId, t.kind] }),
    index('record_links_to_idx').on(t.toRecordId),
  ],
);

export const recordCalculations = sqliteTable(
  'record_calculations',
  {
    recordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    calculationId: text()
      .notNull()
      .references(() => calculations.id, { onDelete: 'cascade' }),
  },
  (t) => [
    primaryKey({ columns: [t.recordId, t.calculationId] }),
    index('record_calculations_calc_idx').on(t.calculationId),
  ],
);

export const attachments = sqliteTable(
  'attachments',
  {
    id: text().primaryKey(),
    recordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    fileName: text().notNull(),
    contentType: text().notNull(),
    size: integer().notNull(),
    /** Files are stored under WAKEBOOK_UPLOADS by this hash, so identical uploads share bytes. */
    sha256: text().notNull(),
    uploadedById: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp().notNull(),
  },
  (t) => [index('attachments_record_idx').on(t.recordId)],
);

export const comments = sqliteTable(
  'comments',
  {
    id: text().primaryKey(),
    recordId: text()
      .notNull()
      .references(() => records.id, { onDelete: 'cascade' }),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    parentId: text(),
    /** A question can be marked answered; a note (answers are notes replying to a question) cannot. */
    kind: text({ enum: COMMENT_KINDS }).notNull().default('note'),
    body: text().notNull(),
    createdAt: timestamp().notNull(),
    editedAt: timestamp(),
    answeredAt: timestamp(),
    answeredById: text().references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('comments_record_idx').on(t.recordId, t.createdAt), index('comments_created_idx').on(t.createdAt)],
);
