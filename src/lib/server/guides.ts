import { getCollection, type CollectionEntry } from 'astro:content';
import { desc, eq } from 'drizzle-orm';
import { db } from './db/client';
import { guideReviews, users } from './db/schema';
import { newId } from './ids';
import { notFound } from './http';
import { recordAudit } from './audit';

export type GuideEntry = CollectionEntry<'guides'>;

export interface GuideSummary {
  slug: string;
  title: string;
  subsystem: string;
  summary: string;
  url: string;
  order: number;
  audience: string;
  reviewedBy: string;
  reviewedOn: string;
  /** Where the review shown comes from: the guide file's front matter, or a review made in the app. */
  reviewSource: 'file' | 'app';
  /** The app review's note, when the app's review is the one shown. */
  reviewNote: string | null;
  reviewStale: boolean;
  calculations: string[];
  /** The MDX file to edit, relative to the repository (for maintainers). */
  filePath: string | null;
}

const YEAR_MS = 365.25 * 24 * 3600 * 1000;

/** A review older than a year earns a note on the guide. `now` is passed in so the rule is testable. */
export function isReviewStale(reviewedOn: Date, now: Date = new Date()): boolean {
  return now.getTime() - reviewedOn.getTime() > YEAR_MS;
}

/** The guide's file as a maintainer finds it in the repository (the loader may hand over an absolute path). */
function repositoryPath(path: string | undefined): string | null {
  if (!path) return null;
  const at = path.replace(/\\/g, '/').indexOf('src/content/guides/');
  return at >= 0 ? path.replace(/\\/g, '/').slice(at) : path;
}

/** The latest review made in the app for one guide. */
export interface AppReview {
  reviewedBy: string;
  reviewedOn: Date;
  note: string | null;
}

/** The summary shows the later of the front matter's review (a day) and the app's (a moment in time). */
export function toGuideSummary(entry: GuideEntry, now: Date = new Date(), app?: AppReview): GuideSummary {
  const d = entry.data;
  const useApp = !!app && app.reviewedOn.getTime() > d.reviewedOn.getTime();
  const reviewedOn = useApp ? app.reviewedOn : d.reviewedOn;
  return {
    slug: entry.id,
    title: d.title,
    subsystem: d.subsystem,
    summary: d.summary,
    url: `/guides/${entry.id}`,
    order: d.order,
    audience: d.audience,
    reviewedBy: useApp ? app.reviewedBy : d.reviewedBy,
    reviewedOn: reviewedOn.toISOString().slice(0, 10),
    reviewSource: useApp ? 'app' : 'file',
    reviewNote: useApp ? app.note : null,
    reviewStale: isReviewStale(reviewedOn, now),
    calculations: d.calculations,
    filePath: repositoryPath(entry.filePath),
  };
}

// Guides are compiled into the build and never change while the server runs: load the collection once.
let all: Promise<GuideEntry[]> | undefined;
function allGuides(): Promise<GuideEntry[]> {
  if (!import.meta.env.PROD) return getCollection('guides'); // dev: pick up edits to the MDX files
  all ??= getCollection('guides');
  return all;
}

/** The newest app review of each guide, by slug. */
function latestAppReviews(slug?: string): Map<string, AppReview> {
  const rows = db()
    .select({ slug: guideReviews.guideSlug, at: guideReviews.createdAt, note: guideReviews.note, name: users.name })
    .from(guideReviews)
    .leftJoin(users, eq(users.id, guideReviews.reviewerId))
    .where(slug ? eq(guideReviews.guideSlug, slug) : undefined)
    .orderBy(desc(guideReviews.createdAt))
    .all();
  const out = new Map<string, AppReview>();
  for (const r of rows)
    if (!out.has(r.slug)) out.set(r.slug, { reviewedBy: r.name ?? 'A former member', reviewedOn: r.at, note: r.note });
  return out;
}

// One collator for every sort (String#localeCompare builds its comparison anew on each call).
const byText = new Intl.Collator().compare;

export async function listGuides(subsystem?: string): Promise<GuideSummary[]> {
  const entries = (await allGuides()).filter((e) => !subsystem || e.data.subsystem === subsystem);
  const reviews = latestAppReviews();
  return entries
    .map((e) => toGuideSummary(e, new Date(), reviews.get(e.id)))
    .sort((a, b) => byText(a.subsystem, b.subsystem) || a.order - b.order || byText(a.title, b.title));
}

export async function findGuide(slug: string): Promise<GuideEntry | undefined> {
  return (await allGuides()).find((e) => e.id === slug);
}

/** One guide's summary with its latest app review taken into account; undefined for an unknown slug. */
export async function guideSummary(slug: string): Promise<GuideSummary | undefined> {
  const entry = await findGuide(slug);
  return entry && toGuideSummary(entry, new Date(), latestAppReviews(slug).get(slug));
}

/** An advisor or lead marks a guide reviewed from the app, with an optional note. */
export async function reviewGuide(slug: string, note: string | undefined, actor: { id: string; email: string }) {
  if (!(await findGuide(slug))) throw notFound('That guide');
  const id = newId();
  db()
    .insert(guideReviews)
    .values({ id, guideSlug: slug, reviewerId: actor.id, note: note || null, createdAt: new Date() })
    .run();
  recordAudit({
    actor,
    action: 'guide.review',
    targetType: 'guide',
    targetId: slug,
    detail: note ? { note } : undefined,
  });
  return (await guideSummary(slug))!;
}
