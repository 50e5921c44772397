import { and, asc, desc, eq, isNull, or, sql, type Column } from 'drizzle-orm';
import { prepared } from '../db/client';
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

/** The ids travel as one JSON array parameter, so the number of records does not change the SQL. */
const inIds = (column: Column) => sql`${column} in (select value from json_each(${sql.placeholder('ids')}))`;

// Each statement is built and prepared once (building and preparing cost more than running them).
const timelineRows = () =>
  prepared('timeline.rows', (d) =>
    d
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
      .where(
        and(
          eq(records.subsystemSlug, sql.placeholder('slug')),
          eq(records.kind, sql.placeholder('kind')),
          isNull(records.deletedAt),
        ),
      )
      .orderBy(desc(seasons.startsOn), asc(records.createdAt))
      .prepare(),
  );

const supersedeLinks = () =>
  prepared('timeline.links', (d) =>
    d
      .select()
      .from(recordLinks)
      .where(
        and(eq(recordLinks.kind, 'supersedes'), or(inIds(recordLinks.fromRecordId), inIds(recordLinks.toRecordId))),
      )
      .prepare(),
  );

const liveTitles = () =>
  prepared('timeline.titles', (d) =>
    d
      .select({ id: records.id, title: records.title })
      .from(records)
      .where(and(inIds(records.id), isNull(records.deletedAt)))
      .prepare(),
  );

/** A subsystem's records season by season (newest season first), with what each decision replaced and what replaced it. */
export function subsystemTimeline(slug: string, kind: 'decision' | 'lesson'): TimelineSeason[] {
  const rows = timelineRows().all({ slug, kind });
  const ids = rows.map((r) => r.id);
  const links = ids.length ? supersedeLinks().all({ ids: JSON.stringify(ids) }) : [];
  const titleOf = new Map(rows.map((r) => [r.id, r.title]));
  const extra = [...new Set(links.flatMap((l) => [l.fromRecordId, l.toRecordId]).filter((x) => !titleOf.has(x)))];
  if (extra.length) for (const r of liveTitles().all({ ids: JSON.stringify(extra) })) titleOf.set(r.id, r.title);
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
