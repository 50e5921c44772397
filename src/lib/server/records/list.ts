import { and, desc, eq, lt, or, isNull, type SQL } from 'drizzle-orm';
import { db } from '../db/client';
import { records, seasons, subsystems, users } from '../db/schema';

export interface RecordListQuery {
  kind?: 'decision' | 'lesson';
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

/** Cursor = "<updatedAt ms>.<id>" of the last row of the previous page (stable under inserts). */
export function encodeCursor(item: { updatedAt: string; id: string }): string {
  return `${Date.parse(item.updatedAt)}.${item.id}`;
}

function decodeCursor(cursor: string): { at: number; id: string } | null {
  const m = /^(\d{1,15})\.([a-z0-9-]{1,64})$/.exec(cursor);
  return m ? { at: Number(m[1]), id: m[2] } : null;
}

export function listRecords(q: RecordListQuery): { records: RecordListItem[]; nextCursor: string | null } {
  const where: (SQL | undefined)[] = [isNull(records.deletedAt)];
  if (q.kind) where.push(eq(records.kind, q.kind));
  if (q.subsystem) where.push(eq(records.subsystemSlug, q.subsystem));
  if (q.season) where.push(eq(records.seasonId, q.season));
  if (q.status) where.push(eq(records.status, q.status as never));
  const c = q.cursor ? decodeCursor(q.cursor) : null;
  if (c) where.push(or(lt(records.updatedAt, new Date(c.at)), and(eq(records.updatedAt, new Date(c.at)), lt(records.id, c.id))));
  const rows = db()
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
    .limit(q.limit + 1)
    .all();
  const page = rows.slice(0, q.limit).map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() }));
  return { records: page, nextCursor: rows.length > q.limit ? encodeCursor(page[page.length - 1]) : null };
}
