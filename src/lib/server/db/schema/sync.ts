import { sqliteTable, text, integer, primaryKey, index } from 'drizzle-orm/sqlite-core';
import { timestamp } from './common';
import { users } from './people';

/**
 * The answer given to a write sent with an `Idempotency-Key` header, kept for a while so that a retry of the same
 * write (an offline change re-sent after a lost answer) gets the same answer instead of making a second record.
 */
export const idempotencyKeys = sqliteTable(
  'idempotency_keys',
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text().notNull(),
    method: text().notNull(),
    path: text().notNull(),
    status: integer().notNull(),
    /** The JSON body of the first answer ('' for 204). */
    body: text().notNull().default(''),
    createdAt: timestamp().notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] }), index('idempotency_keys_created_idx').on(t.createdAt)],
);
