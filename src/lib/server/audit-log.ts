import { desc, lt, eq, and, or, like, inArray, type SQL } from 'drizzle-orm';
import { db } from './db/client';
import {
  auditEntries,
  calculations,
  guideSuggestions,
  imports,
  invitations,
  records,
  seasons,
  subsystems,
  users,
} from './db/schema';
import { listGuides } from './guides';
import { actionInWords } from '../audit-words';

/** What an entry acted on, by its title, with a link when the thing still exists and has a page. */
export interface AuditTarget {
  title: string;
  url: string | null;
}

type Ref = { type: string; id: string };

/** Titles (and pages) for the targets of a page of entries: one query per kind of target. */
async function resolveTargets(refs: Ref[]): Promise<Map<string, AuditTarget>> {
  const out = new Map<string, AuditTarget>();
  const ids = (type: string) => [...new Set(refs.filter((r) => r.type === type).map((r) => r.id))];
  const put = (type: string, id: string, title: string, url: string | null) => out.set(`${type}:${id}`, { title, url });
  const rec = ids('record');
  if (rec.length)
    for (const r of db()
      .select({ id: records.id, title: records.title, deletedAt: records.deletedAt })
      .from(records)
      .where(inArray(records.id, rec))
      .all())
      put('record', r.id, r.title, r.deletedAt ? null : `/records/${r.id}`);
  const calc = ids('calculation');
  if (calc.length)
    for (const c of db()
      .select({ id: calculations.id, title: calculations.title, deletedAt: calculations.deletedAt })
      .from(calculations)
      .where(inArray(calculations.id, calc))
      .all())
      put('calculation', c.id, c.title, c.deletedAt ? null : `/calculations/${c.id}`);
  const people = ids('user');
  if (people.length)
    for (const u of db()
      .select({ id: users.id, name: users.name, email: users.email })
      .from(users)
      .where(inArray(users.id, people))
      .all())
      put('user', u.id, `${u.name} (${u.email})`, `/admin/people?q=${encodeURIComponent(u.email)}`);
  const seas = ids('season');
  if (seas.length)
    for (const x of db()
      .select({ id: seasons.id, name: seasons.name })
      .from(seasons)
      .where(inArray(seasons.id, seas))
      .all())
      put('season', x.id, `season ${x.name}`, '/seasons');
  const subs = ids('subsystem');
  if (subs.length)
    for (const x of db()
      .select({ slug: subsystems.slug, name: subsystems.name })
      .from(subsystems)
      .where(inArray(subsystems.slug, subs))
      .all())
      put('subsystem', x.slug, x.name, `/subsystems/${x.slug}`);
  const imp = ids('import');
  if (imp.length)
    for (const x of db()
      .select({ id: imports.id, total: imports.total, name: subsystems.name })
      .from(imports)
      .innerJoin(subsystems, eq(subsystems.slug, imports.subsystemSlug))
      .where(inArray(imports.id, imp))
      .all())
      put('import', x.id, `${x.total} ${x.total === 1 ? 'file' : 'files'} into ${x.name}`, null);
  const inv = ids('invitation');
  if (inv.length)
    for (const x of db()
      .select({ id: invitations.id, name: invitations.name, email: invitations.email })
      .from(invitations)
      .where(inArray(invitations.id, inv))
      .all())
      put('invitation', x.id, `${x.name} (${x.email})`, '/admin/invitations');
  const sugg = ids('guide-suggestion');
  const suggestionGuide = new Map<string, string>();
  if (sugg.length)
    for (const x of db()
      .select({ id: guideSuggestions.id, slug: guideSuggestions.guideSlug })
      .from(guideSuggestions)
      .where(inArray(guideSuggestions.id, sugg))
      .all())
      suggestionGuide.set(x.id, x.slug);
  if (ids('guide').length || suggestionGuide.size) {
    const guides = new Map((await listGuides()).map((g) => [g.slug, g]));
    for (const slug of ids('guide')) {
      const g = guides.get(slug);
      put('guide', slug, g?.title ?? slug, g?.url ?? null);
    }
    for (const [id, slug] of suggestionGuide) {
      const g = guides.get(slug);
      put('guide-suggestion', id, g?.title ?? slug, g ? `${g.url}#suggestions-h` : null);
    }
  }
  return out;
}

export interface AuditQuery {
  limit: number;
  before?: number;
  action?: string;
  actor?: string;
}

/**
 * Newest first, paged by id (`before` is the last id of the previous page). Each entry carries its action in words
 * and its target by title; a failed sign-in is listed under the address that was tried.
 */
export async function listAudit(q: AuditQuery) {
  const where: SQL[] = [];
  if (q.before) where.push(lt(auditEntries.id, q.before));
  if (q.action) where.push(like(auditEntries.action, `${q.action.replace(/[%_]/g, '')}%`));
  // A failed sign-in has no actor; it is found under the address that was tried.
  if (q.actor)
    where.push(
      or(
        eq(auditEntries.actorLabel, q.actor),
        and(eq(auditEntries.action, 'auth.sign-in-failed'), eq(auditEntries.targetId, q.actor)),
      )!,
    );
  const rows = db()
    .select()
    .from(auditEntries)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEntries.id))
    .limit(q.limit + 1)
    .all();
  const page = rows.slice(0, q.limit);
  const titles = await resolveTargets(
    page.filter((r) => r.targetType && r.targetId).map((r) => ({ type: r.targetType!, id: r.targetId! })),
  );
  return {
    entries: page.map((r) => {
      const failed = r.action === 'auth.sign-in-failed' && r.targetType === 'user' && !!r.targetId;
      // "Ana signed in: Ana" says nothing twice; a target that is the actor is left out.
      const self = r.targetType === 'user' && !!r.actorId && r.targetId === r.actorId;
      const resolved = r.targetType && r.targetId && !self ? titles.get(`${r.targetType}:${r.targetId}`) : undefined;
      return {
        id: r.id,
        at: r.at.toISOString(),
        actor: failed ? r.targetId! : r.actorLabel,
        action: r.action,
        actionText: actionInWords(r.action),
        target: r.targetType ? `${r.targetType}${r.targetId ? `:${r.targetId}` : ''}` : null,
        targetTitle: failed || self ? null : (resolved?.title ?? (r.targetId ? `${r.targetType} ${r.targetId}` : null)),
        targetUrl: failed ? null : (resolved?.url ?? null),
        detail: r.detail,
      };
    }),
    nextCursor: rows.length > q.limit ? String(page[page.length - 1].id) : null,
  };
}
