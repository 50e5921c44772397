import { and, asc, desc, eq, inArray, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { recordLinks, records, seasons } from '../db/schema';

export interface TimelineEntry {
  id: string;
  title: string;
  status: string;
  kind: string;
  createdAt: string;
  replaces: { id: string; title: string }[];
  replacedBy: { id: string; title: string }[];
}

export interface TimelineSeason {
  seasonId: string;
  season: string;
  current: boolean;
  entries: TimelineEntry[];
}

/** A subsystem's records season by season (newest season first), with what each decision replaced and what replaced it. */
export function subsystemTimeline(slug: string, kind: 'decision' | 'lesson'): TimelineSeason[] {
  const rows = db()
    .select({
      id: records.id,
      title: records.title,
      status: records.status,
      kind: records.kind,
      createdAt: records.createdAt,
      seasonId: seasons.id,
      season: seasons.name,
      startsOn: seasons.startsOn,
      current: seasons.isCurrent,
    })
    .from(records)
    .innerJoin(seasons, eq(seasons.id, records.seasonId))
    .where(and(eq(records.subsystemSlug, slug), eq(records.kind, kind), isNull(records.deletedAt)))
    .orderBy(desc(seasons.startsOn), asc(records.createdAt))
    .all();
  const ids = rows.map((r) => r.id);
  const links = ids.length
    ? db()
        .select()
        .from(recordLinks)
        .where(and(eq(recordLinks.kind, 'supersedes'), inArray(recordLinks.fromRecordId, ids)))
        .all()
        .concat(
          db()
            .select()
            .from(recordLinks)
            .where(and(eq(recordLinks.kind, 'supersedes'), inArray(recordLinks.toRecordId, ids)))
            .all(),
        )
    : [];
  const titleOf = new Map(rows.map((r) => [r.id, r.title]));
  const extra = [...new Set(links.flatMap((l) => [l.fromRecordId, l.toRecordId]).filter((x) => !titleOf.has(x)))];
  if (extra.length)
    for (const r of db()
      .select({ id: records.id, title: records.title })
      .from(records)
      .where(and(inArray(records.id, extra), isNull(records.deletedAt)))
      .all())
      titleOf.set(r.id, r.title);
  const seasonsOut: TimelineSeason[] = [];
  for (const r of rows) {
    let s = seasonsOut.find((x) => x.seasonId === r.seasonId);
    if (!s) {
      s = { seasonId: r.seasonId, season: r.season, current: r.current, entries: [] };
      seasonsOut.push(s);
    }
    // A deleted record on the other end of a link is left out, title and link both.
    const uniq = (xs: string[]) =>
      [...new Set(xs)].filter((id) => titleOf.has(id)).map((id) => ({ id, title: titleOf.get(id)! }));
    s.entries.push({
      id: r.id,
      title: r.title,
      status: r.status,
      kind: r.kind,
      createdAt: r.createdAt.toISOString(),
      replaces: uniq(links.filter((l) => l.fromRecordId === r.id).map((l) => l.toRecordId)),
      replacedBy: uniq(links.filter((l) => l.toRecordId === r.id).map((l) => l.fromRecordId)),
    });
  }
  return seasonsOut;
}
