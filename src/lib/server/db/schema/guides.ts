import { sqliteTable, text, index } from 'drizzle-orm/sqlite-core';
import { SUGGESTION_STATES } from '../../../domain';
import { timestamp } from './common';
import { users } from './people';

/** A review of a guide made from the app (the guide's file may carry an older one in its front matter). */
export const guideReviews = sqliteTable(
  'guide_reviews',
  {
    id: text().primaryKey(),
    guideSlug: text().notNull(),
    reviewerId: text().references(() => users.id, { onDelete: 'set null' }),
    note: text(),
    createdAt: timestamp().notNull(),
  },
  (t) => [index('guide_reviews_slug_idx').on(t.guideSlug, t.createdAt)],
);

/** A change to a guide suggested by anyone signed in; advisors and leads mark it done or declined. */
export const guideSuggestions = sqliteTable(
  'guide_suggestions',
  {
    id: text().primaryKey(),
    guideSlug: text().notNull(),
    section: text(),
    body: text().notNull(),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    state: text({ enum: SUGGESTION_STATES }).notNull().default('open'),
    createdAt: timestamp().notNull(),
    decidedAt: timestamp(),
    decidedById: text().references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('guide_suggestions_slug_idx').on(t.guideSlug, t.state)],
);
