import { sqliteTable, text, index } from 'drizzle-orm/sqlite-core';
import type { Grid, SeriesSet } from '../../../calc/types';
import { timestamp } from './common';
import { users, seasons, subsystems } from './people';

/** A saved run of one calculator. Its results live in calculation_results, newest last. */
export const calculations = sqliteTable(
  'calculations',
  {
    id: text().primaryKey(),
    kind: text().notNull(),
    title: text().notNull(),
    subsystemSlug: text()
      .notNull()
      .references(() => subsystems.slug, { onUpdate: 'cascade' }),
    seasonId: text()
      .notNull()
      .references(() => seasons.id),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    notes: text().notNull().default(''),
    inputs: text({ mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    createdAt: timestamp().notNull(),
    updatedAt: timestamp().notNull(),
    deletedAt: timestamp(),
  },
  (t) => [
    index('calculations_subsystem_season_idx').on(t.subsystemSlug, t.seasonId),
    index('calculations_kind_idx').on(t.kind),
  ],
);

/** Each compute of a saved calculation; recomputing adds a row and keeps the earlier ones. */
export const calculationResults = sqliteTable(
  'calculation_results',
  {
    id: text().primaryKey(),
    calculationId: text()
      .notNull()
      .references(() => calculations.id, { onDelete: 'cascade' }),
    engineVersion: text().notNull(),
    outputs: text({ mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    series: text({ mode: 'json' }).$type<{
      series?: Record<string, SeriesSet> | null;
      grid?: Grid | null;
      grids?: Grid[];
    }>(),
    warnings: text({ mode: 'json' }).$type<string[]>().notNull(),
    computedById: text().references(() => users.id, { onDelete: 'set null' }),
    computedAt: timestamp().notNull(),
  },
  (t) => [index('calculation_results_calc_idx').on(t.calculationId, t.computedAt)],
);
