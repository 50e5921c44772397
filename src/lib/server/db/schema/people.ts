import { sqliteTable, text, integer, uniqueIndex, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { sql } from 'drizzle-orm';
import { ROLES, SEASON_PHASES } from '../../../domain';
import { timestamp } from './common';

export const users = sqliteTable('users', {
  id: text().primaryKey(),
  email: text().notNull().unique(),
  name: text().notNull(),
  role: text({ enum: ROLES }).notNull(),
  passwordHash: text().notNull(),
  digestOptIn: integer({ mode: 'boolean' }).notNull().default(false),
  /** E-mail me when someone asks a question on my records or on a subsystem I owned in an earlier season. */
  notifyQuestions: integer({ mode: 'boolean' }).notNull().default(true),
  /** E-mail me when one of my questions is answered. */
  notifyAnswers: integer({ mode: 'boolean' }).notNull().default(true),
  createdAt: timestamp().notNull(),
  lastSignInAt: timestamp(),
});

/** Lucia 3 session table: expires_at is UNIX seconds (the adapter's convention). */
export const sessions = sqliteTable(
  'sessions',
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: integer().notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const seasons = sqliteTable(
  'seasons',
  {
    id: text().primaryKey(),
    name: text().notNull().unique(),
    startsOn: text().notNull(), // YYYY-MM-DD
    endsOn: text().notNull(),
    phase: text({ enum: SEASON_PHASES }).notNull(),
    isCurrent: integer({ mode: 'boolean' }).notNull().default(false),
    boat: text(),
    createdAt: timestamp().notNull(),
  },
  // Exactly one season may be current: the database refuses a second one.
  (t) => [
    uniqueIndex('seasons_one_current')
      .on(t.isCurrent)
      .where(sql`is_current = 1`),
  ],
);

export const subsystems = sqliteTable('subsystems', {
  slug: text().primaryKey(),
  name: text().notNull(),
  summary: text().notNull().default(''),
  position: integer().notNull().default(0),
  /** Whether a design calculator applies here, so readiness asks accepted decisions to link a calculation. */
  calculationsApply: integer({ mode: 'boolean' }).notNull().default(true),
  createdAt: timestamp().notNull(),
});

/** A person's part in one season: their role that season and the subsystems they own. */
export const seasonMemberships = sqliteTable(
  'season_memberships',
  {
    id: text().primaryKey(),
    seasonId: text()
      .notNull()
      .references(() => seasons.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text({ enum: ROLES }).notNull(),
  },
  (t) => [
    uniqueIndex('season_memberships_unique').on(t.seasonId, t.userId),
    index('season_memberships_user_idx').on(t.userId),
  ],
);

export const membershipSubsystems = sqliteTable(
  'membership_subsystems',
  {
    membershipId: text()
      .notNull()
      .references(() => seasonMemberships.id, { onDelete: 'cascade' }),
    subsystemSlug: text()
      .notNull()
      .references(() => subsystems.slug, { onDelete: 'cascade', onUpdate: 'cascade' }),
  },
  (t) => [
    primaryKey({ columns: [t.membershipId, t.subsystemSlug] }),
    index('membership_subsystems_slug_idx').on(t.subsystemSlug),
  ],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: text().primaryKey(),
    email: text().notNull(),
    name: text().notNull(),
    role: text({ enum: ROLES }).notNull(),
    subsystems: text({ mode: 'json' })
      .$type<string[]>()
      .notNull()
      .default(sql`'[]'`),
    tokenHash: text().notNull().unique(),
    invitedById: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp().notNull(),
    expiresAt: timestamp().notNull(),
    acceptedAt: timestamp(),
    acceptedUserId: text().references(() => users.id, { onDelete: 'set null' }),
    revokedAt: timestamp(),
  },
  (t) => [index('invitations_email_idx').on(t.email)],
);

export const passwordResets = sqliteTable(
  'password_resets',
  {
    tokenHash: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: timestamp().notNull(),
    expiresAt: timestamp().notNull(),
    usedAt: timestamp(),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);
