import { desc, lt, eq, and, like, type SQL } from 'drizzle-orm';
import { db } from './db/client';
import { auditEntries } from './db/schema';

export interface AuditQuery {
  limit: number;
  before?: number;
  action?: string;
  actor?: string;
}

/** Newest first, paged by id (`before` is the last id of the previous page). */
export function listAudit(q: AuditQuery) {
  const where: SQL[] = [];
  if (q.before) where.push(lt(auditEntries.id, q.before));
  if (q.action) where.push(like(auditEntries.action, `${q.action.replace(/[%_]/g, '')}%`));
  if (q.actor) where.push(eq(auditEntries.actorLabel, q.actor));
  const rows = db()
    .select()
    .from(auditEntries)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEntries.id))
    .limit(q.limit + 1)
    .all();
  const page = rows.slice(0, q.limit);
  return {
    entries: page.map((r) => ({
      id: r.id,
      at: r.at.toISOString(),
      actor: r.actorLabel,
      action: r.action,
      target: r.targetType ? `${r.targetType}${r.targetId ? `:${r.targetId}` : ''}` : null,
      detail: r.detail,
    })),
    nextCursor: rows.length > q.limit ? String(page[page.length - 1].id) : null,
  };
}
