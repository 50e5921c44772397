import { and, asc, desc, eq, lt, ne, or, isNull, sql, type SQL } from 'drizzle-orm';
import type { RecordKind } from '../../domain';
import { prepared } from '../db/client';
import { decodeCursor, encodeCursor } from '../cursor';
import { records, seasons, subsystems, users } from '../db/schema';

export interface RecordListQuery {
  kind?: RecordKind;
  subsystem?: string;
  season?: string; // season id
  status?: string;
  limit: number;
  cursor?: string;
}

export interface RecordListItem {
  id: string;
  kind: string;
  title: string;
  status: string;
  subsystem: string;
  subsystemName: string;
  seasonId: string;
  season: string;
  author: string | null;
  updatedAt: string;
  version: number;
}

const p = (name: string) => sql.placeholder(name);

/**
 * One prepared statement per combination of filters (at most 32), with the values as parameters: building and
 * preparing the SQL costs more than running it.
 */
function listQuery(shape: { kind: boolean; subsystem: boolean; season: boolean; status: boolean; cursor: boolean }) {
  const key = `records.list:${Object.values(shape).map(Number).join('')}`;
  return prepared(key, (d) => {
    const where: (SQL | undefined)[] = [isNull(records.deletedAt)];
    if (shape.kind) where.push(eq(records.kind, p('kind')));
    if (shape.subsystem) where.push(eq(records.subsystemSlug, p('subsystem')));
    if (shape.season) where.push(eq(records.seasonId, p('season')));
    if (shape.status) where.push(eq(records.status, p('status')));
    if (shape.cursor)
      where.push(or(lt(records.updatedAt, p('at')), and(eq(records.updatedAt, p('at')), lt(records.id, p('id')))));
    return d
      .select({
        id: records.id,
        kind: records.kind,
        title: records.title,
        status: records.status,
        subsystem: records.subsystemSlug,
        subsystemName: subsystems.name,
        seasonId: records.seasonId,
        season: seasons.name,
        author: users.name,
        updatedAt: records.updatedAt,
        version: records.version,
      })
      .from(records)
      .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
      .innerJoin(seasons, eq(seasons.id, records.seasonId))
      .leftJoin(users, eq(users.id, records.authorId))
      .where(and(...where))
      .orderBy(desc(records.updatedAt), desc(records.id))
      .limit(p('limit'))
      .prepare();
  });
}

export function listRecords(q: RecordListQuery): { records: RecordListItem[]; nextCursor: string | null } {
  const c = decodeCursor(q.cursor);
  const shape = { kind: !!q.kind, subsystem: !!q.subsystem, season: !!q.season, status: !!q.status, cursor: !!c };
  // Placeholders reach SQLite as given: timestamps are stored as milliseconds, like the cursor carries them.
  const rows = listQuery(shape).all({
    kind: q.kind,
    subsystem: q.subsystem,
    season: q.season,
    status: q.status,
    at: c?.at,
    id: c?.id,
    limit: q.limit + 1,
  });
  const page = rows.slice(0, q.limit).map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() }));
  return {
    records: page,
    nextCursor: rows.length > q.limit ? encodeCursor(page[page.length - 1].updatedAt, page[page.length - 1].id) : null,
  };
}

export interface AwaitingReview {
  id: string;
  title: string;
  subsystemName: string;
  season: string;
  author: string | null;
  /** When the decision was last changed: proposing it, or an edit since its last review. */
  since: string;
  reviewedEarlier: boolean;
}

/**
 * Proposed decisions whose current version nobody has reviewed: what advisors and leads see first on their home
 * page. The longest-waiting first.
 */
export function listAwaitingReview(limit = 20): AwaitingReview[] {
  return prepared('records.awaitingReview', (d) =>
    d
      .select({
        id: records.id,
        title: records.title,
        subsystemName: subsystems.name,
        season: seasons.name,
        author: users.name,
        since: records.updatedAt,
        reviewedVersion: records.reviewedVersion,
      })
      .from(records)
      .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
      .innerJoin(seasons, eq(seasons.id, records.seasonId))
      .leftJoin(users, eq(users.id, records.authorId))
      .where(
        and(
          isNull(records.deletedAt),
          eq(records.kind, 'decision'),
          eq(records.status, 'proposed'),
          or(isNull(records.reviewedVersion), ne(records.reviewedVersion, records.version)),
        ),
      )
      .orderBy(asc(records.updatedAt), asc(records.id))
      .limit(p('limit'))
      .prepare(),
  )
    .all({ limit })
    .map(({ reviewedVersion, ...r }) => ({
      ...r,
      since: r.since.toISOString(),
      reviewedEarlier: reviewedVersion !== null,
    }));
}
