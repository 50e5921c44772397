import { sqliteTable, text, integer, index, uniqueIndex, primaryKey } from 'drizzle-orm/sqlite-core';
import { ONBOARDING_ITEM_KINDS } from '../../../domain';
import { timestamp } from './common';
import { users, subsystems } from './people';

/** One ordered step of a subsystem's onboarding route: a guide (by slug), a record or a calculation (by id). */
export const onboardingItems = sqliteTable(
  'onboarding_items',
  {
    id: text().primaryKey(),
    subsystemSlug: text()
      .notNull()
      .references(() => subsystems.slug, { onDelete: 'cascade', onUpdate: 'cascade' }),
    position: integer().notNull(),
    kind: text({ enum: ONBOARDING_ITEM_KINDS }).notNull(),
    ref: text().notNull(),
    addedById: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp().notNull(),
  },
  (t) => [
    uniqueIndex('onboarding_items_ref').on(t.subsystemSlug, t.kind, t.ref),
    index('onboarding_items_pos_idx').on(t.subsystemSlug, t.position),
  ],
);

export const onboardingProgress = sqliteTable(
  'onboarding_progress',
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    itemId: text()
      .notNull()
      .references(() => onboardingItems.id, { onDelete: 'cascade' }),
    doneAt: timestamp().notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.itemId] })],
);

/** Who changed what, when. Never updated, never deleted by the app. */
export const auditEntries = sqliteTable(
  'audit_entries',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    at: timestamp().notNull(),
    actorId: text().references(() => users.id, { onDelete: 'set null' }),
    actorLabel: text().notNull(),
    action: text().notNull(),
    targetType: text(),
    targetId: text(),
    detail: text({ mode: 'json' }).$type<Record<string, unknown>>(),
    ip: text(),
  },
  (t) => [
    index('audit_entries_at_idx').on(t.at),
    index('audit_entries_action_idx').on(t.action),
    // A person's own entries (the home page asks whether someone is a new invitee on every visit).
    index('audit_entries_actor_idx').on(t.actorId, t.action),
  ],
);

/** Mail as sent (or captured when no SMTP server is set), so leads can read it and failures are never silent. */
export const mailMessages = sqliteTable(
  'mail_messages',
  {
    id: text().primaryKey(),
    to: text().notNull(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text().notNull(),
    transport: text().$type<'capture' | 'smtp'>().notNull(),
    status: text().$type<'captured' | 'sent' | 'failed'>().notNull(),
    error: text(),
    sentAt: timestamp().notNull(),
  },
  (t) => [index('mail_messages_sent_idx').on(t.sentAt)],
);
