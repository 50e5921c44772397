import { getCollection, type CollectionEntry } from 'astro:content';

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
  reviewStale: boolean;
  calculations: string[];
}

const YEAR_MS = 365.25 * 24 * 3600 * 1000;

/** A review older than a year earns a note on the guide. `now` is passed in so the rule is testable. */
export function isReviewStale(reviewedOn: Date, now: Date = new Date()): boolean {
  return now.getTime() - reviewedOn.getTime() > YEAR_MS;
}

export function toGuideSummary(entry: GuideEntry, now: Date = new Date()): GuideSummary {
  const d = entry.data;
  return {
    slug: entry.id,
    title: d.title,
    subsystem: d.subsystem,
    summary: d.summary,
    url: `/guides/${entry.id}`,
    order: d.order,
    audience: d.audience,
    reviewedBy: d.reviewedBy,
    reviewedOn: d.reviewedOn.toISOString().slice(0, 10),
    reviewStale: isReviewStale(d.reviewedOn, now),
    calculations: d.calculations,
  };
}

// Guides are compiled into the build and never change while the server runs: load the collection once.
let all: Promise<GuideEntry[]> | undefined;
function allGuides(): Promise<GuideEntry[]> {
  if (!import.meta.env.PROD) return getCollection('guides'); // dev: pick up edits to the MDX files
  all ??= getCollection('guides');
  return all;
}

// One collator for every sort (String#localeCompare builds its comparison anew on each call).
const byText = new Intl.Collator().compare;

export async function listGuides(subsystem?: string): Promise<GuideSummary[]> {
  const entries = (await allGuides()).filter((e) => !subsystem || e.data.subsystem === subsystem);
  return entries
    .map((e) => toGuideSummary(e))
    .sort((a, b) => byText(a.subsystem, b.subsystem) || a.order - b.order || byText(a.title, b.title));
}

export async function findGuide(slug: string): Promise<GuideEntry | undefined> {
  return (await allGuides()).find((e) => e.id === slug);
}
