import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { db, prepared } from './db/client';
import { memoUntilWrite } from './memo';
import {
  calculations,
  onboardingItems,
  onboardingProgress,
  records,
  seasonMemberships,
  seasons,
  users,
} from './db/schema';
import { invalidInput, notFound } from './http';
import { newId } from './ids';
import { recordAudit } from './audit';
import { findSubsystem, listSubsystems } from './seasons';
import { listGuides, type GuideSummary } from './guides';

export type ItemKind = 'guide' | 'record' | 'calculation';

export interface RouteItem {
  id: string;
  kind: ItemKind;
  ref: string;
  title: string;
  detail: string;
  url: string | null;
  exists: boolean;
  seasonId: string | null;
  done: boolean;
}

export interface RouteView {
  subsystem: string;
  items: RouteItem[];
  progress: { done: number; total: number };
}

interface Resolved {
  title: string;
  detail: string;
  url: string;
  seasonId: string | null;
}

/** Looks up what each (kind, ref) points at; missing ones are absent from the map. */
async function resolve(refs: { kind: ItemKind; ref: string }[]): Promise<Map<string, Resolved>> {
  const out = new Map<string, Resolved>();
  const of = (k: ItemKind) => refs.filter((r) => r.kind === k).map((r) => r.ref);
  if (of('guide').length) {
    const guides = new Map((await listGuides()).map((g: GuideSummary) => [g.slug, g]));
    for (const slug of of('guide')) {
      const g = guides.get(slug);
      if (g) out.set(`guide:${slug}`, { title: g.title, detail: 'Guide', url: g.url, seasonId: null });
    }
  }
  if (of('record').length) {
    for (const r of db()
      .select({
        id: records.id,
        title: records.title,
        kind: records.kind,
        seasonId: records.seasonId,
        season: seasons.name,
      })
      .from(records)
      .innerJoin(seasons, eq(seasons.id, records.seasonId))
      .where(and(inArray(records.id, of('record')), isNull(records.deletedAt)))
      .all()) {
      out.set(`record:${r.id}`, {
        title: r.title,
        detail: `${r.kind === 'decision' ? 'Decision record' : 'Lesson'} · ${r.season}`,
        url: `/records/${r.id}`,
        seasonId: r.seasonId,
      });
    }
  }
  if (of('calculation').length) {
    for (const c of db()
      .select({ id: calculations.id, title: calculations.title, seasonId: calculations.seasonId, season: seasons.name })
      .from(calculations)
      .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
      .where(and(inArray(calculations.id, of('calculation')), isNull(calculations.deletedAt)))
      .all()) {
      out.set(`calculation:${c.id}`, {
        title: c.title,
        detail: `Saved calculation · ${c.season}`,
        url: `/calculations/${c.id}`,
        seasonId: c.seasonId,
      });
    }
  }
  return out;
}

type ResolvedItem = Omit<RouteItem, 'done'>;

/**
 * Every subsystem's route with each item resolved (one query, one lookup of what the items point at), shared by
 * everyone until the next write: a page that shows the progress of every route probes the write generation once.
 */
function allRouteItems(): Promise<Map<string, ResolvedItem[]>> {
  return memoUntilWrite('onboarding.routes', async () => {
    const rows = db()
      .select()
      .from(onboardingItems)
      .orderBy(asc(onboardingItems.subsystemSlug), asc(onboardingItems.position))
      .all();
    const resolved = await resolve(rows.map((r) => ({ kind: r.kind, ref: r.ref })));
    const out = new Map<string, ResolvedItem[]>();
    for (const r of rows) {
      const x = resolved.get(`${r.kind}:${r.ref}`);
      const list = out.get(r.subsystemSlug) ?? [];
      list.push({
        id: r.id,
        kind: r.kind,
        ref: r.ref,
        title: x?.title ?? 'No longer exists',
        detail: x?.detail ?? `${r.kind} ${r.ref}`,
        url: x?.url ?? null,
        exists: !!x,
        seasonId: x?.seasonId ?? null,
      });
      out.set(r.subsystemSlug, list);
    }
    return out;
  });
}

/** The ids of every onboarding item a person has ticked. */
function ticked(userId: string): Set<string> {
  return memoUntilWrite(
    `onboarding.ticked:${userId}`,
    () =>
      new Set(
        prepared('onboarding.ticked', (d) =>
          d
            .select({ itemId: onboardingProgress.itemId })
            .from(onboardingProgress)
            .where(eq(onboardingProgress.userId, sql.placeholder('user')))
            .prepare(),
        )
          .all({ user: userId })
          .map((p) => p.itemId),
      ),
  );
}

function routeView(slug: string, routes: Map<string, ResolvedItem[]>, done: Set<string>): RouteView {
  const items: RouteItem[] = (routes.get(slug) ?? []).map((i) => ({ ...i, done: done.has(i.id) }));
  const live = items.filter((i) => i.exists);
  return { subsystem: slug, items, progress: { done: live.filter((i) => i.done).length, total: live.length } };
}

export async function getRoute(slug: string, userId: string | null): Promise<RouteView> {
  if (!findSubsystem(slug)) throw notFound('That subsystem');
  return routeView(slug, await allRouteItems(), userId ? ticked(userId) : new Set<string>());
}

/** Replaces a route. Items that stay keep their ids, so people's ticks survive a reorder. */
export async function replaceRoute(
  slug: string,
  items: { kind: ItemKind; ref: string }[],
  actor: { id: string; email: string },
): Promise<RouteView> {
  if (!findSubsystem(slug)) throw notFound('That subsystem');
  const seen = new Set<string>();
  const issues: { path: string; message: string }[] = [];
  items.forEach((it, i) => {
    const key = `${it.kind}:${it.ref}`;
    if (seen.has(key)) issues.push({ path: `items.${i}.ref`, message: 'This item is on the route twice.' });
    seen.add(key);
  });
  const resolved = await resolve(items);
  items.forEach((it, i) => {
    if (!resolved.has(`${it.kind}:${it.ref}`))
      issues.push({ path: `items.${i}.ref`, message: `No ${it.kind} “${it.ref}” exists.` });
  });
  if (issues.length) throw invalidInput(issues, 'Some route items do not exist.');
  const now = new Date();
  db().transaction((tx) => {
    const existing = tx.select().from(onboardingItems).where(eq(onboardingItems.subsystemSlug, slug)).all();
    const byKey = new Map(existing.map((e) => [`${e.kind}:${e.ref}`, e]));
    const keep = new Set(items.map((it) => `${it.kind}:${it.ref}`));
    for (const e of existing)
      if (!keep.has(`${e.kind}:${e.ref}`)) tx.delete(onboardingItems).where(eq(onboardingItems.id, e.id)).run();
    items.forEach((it, position) => {
      const e = byKey.get(`${it.kind}:${it.ref}`);
      if (e) tx.update(onboardingItems).set({ position }).where(eq(onboardingItems.id, e.id)).run();
      else
        tx.insert(onboardingItems)
          .values({
            id: newId(),
            subsystemSlug: slug,
            position,
            kind: it.kind,
            ref: it.ref,
            addedById: actor.id,
            createdAt: now,
          })
          .run();
    });
  });
  recordAudit({
    actor,
    action: 'onboarding.route',
    targetType: 'subsystem',
    targetId: slug,
    detail: { items: items.length },
  });
  return getRoute(slug, actor.id);
}

export function setProgress(slug: string, userId: string, itemId: string, done: boolean): void {
  const item = db()
    .select()
    .from(onboardingItems)
    .where(and(eq(onboardingItems.id, itemId), eq(onboardingItems.subsystemSlug, slug)))
    .get();
  if (!item) throw notFound('That onboarding item');
  if (done) db().insert(onboardingProgress).values({ userId, itemId, doneAt: new Date() }).onConflictDoNothing().run();
  else
    db()
      .delete(onboardingProgress)
      .where(and(eq(onboardingProgress.userId, userId), eq(onboardingProgress.itemId, itemId)))
      .run();
}

/** Route progress of one person across all subsystems that have a route. */
export async function progressOf(userId: string) {
  const out: { slug: string; name: string; done: number; total: number }[] = [];
  const routes = await allRouteItems();
  const done = ticked(userId);
  for (const s of listSubsystems()) {
    const r = routeView(s.slug, routes, done);
    if (r.progress.total > 0) out.push({ slug: s.slug, name: s.name, ...r.progress });
  }
  return out;
}

/** For leads: everyone in the current season (newest members first) × subsystem route progress. */
export async function progressTable(seasonId: string) {
  const people = db()
    .select({ id: users.id, name: users.name, role: seasonMemberships.role })
    .from(seasonMemberships)
    .innerJoin(users, eq(users.id, seasonMemberships.userId))
    .where(eq(seasonMemberships.seasonId, seasonId))
    .orderBy(asc(users.name))
    .all();
  const subsystems = listSubsystems();
  const routes = await allRouteItems();
  const rows = [];
  for (const p of people) {
    const cells = [];
    const done = ticked(p.id);
    for (const s of subsystems) cells.push({ slug: s.slug, ...routeView(s.slug, routes, done).progress });
    rows.push({ ...p, cells });
  }
  return { subsystems, rows };
}
