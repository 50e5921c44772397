import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { IMPORT_ITEM_STATES, IMPORT_STATES, RECORD_KINDS } from '../../../domain';
import { timestamp } from './common';
import { users, seasons, subsystems } from './people';
import { records } from './records';

/** One import: the files a person dropped on /import in one go, converted into draft records off the request path. */
export const imports = sqliteTable(
  'imports',
  {
    id: text().primaryKey(),
    userId: text().references(() => users.id, { onDelete: 'set null' }),
    subsystemSlug: text()
      .notNull()
      .references(() => subsystems.slug, { onUpdate: 'cascade' }),
    kind: text({ enum: RECORD_KINDS }).notNull(),
    /** Null: each file goes to the season its own date falls in, else the current one. */
    seasonId: text().references(() => seasons.id),
    state: text({ enum: IMPORT_STATES }).notNull().default('queued'),
    total: integer().notNull().default(0),
    done: integer().notNull().default(0),
    createdAt: timestamp().notNull(),
    finishedAt: timestamp(),
  },
  (t) => [index('imports_user_idx').on(t.userId, t.createdAt)],
);

/** One file of an import (a file inside a zip counts as one). Its bytes are kept in storage under `sha256`. */
export const importItems = sqliteTable(
  'import_items',
  {
    id: text().primaryKey(),
    importId: text()
      .notNull()
      .references(() => imports.id, { onDelete: 'cascade' }),
    position: integer().notNull(),
    fileName: text().notNull(),
    size: integer().notNull(),
    sha256: text().notNull(),
    state: text({ enum: IMPORT_ITEM_STATES }).notNull().default('queued'),
    /** Why it was skipped or failed, as a sentence. */
    message: text(),
    recordId: text().references(() => records.id, { onDelete: 'set null' }),
    createdAt: timestamp().notNull(),
    finishedAt: timestamp(),
  },
  (t) => [index('import_items_import_idx').on(t.importId, t.position), index('import_items_sha_idx').on(t.sha256)],
);
