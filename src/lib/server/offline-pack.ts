// GET /api/offline/pack: what a person's browser keeps for reading offline (decision 017). Every guide; the records
// and lessons of the person's subsystems in all seasons; the saved calculations of those subsystems; the calculator
// pages; the person's onboarding routes with their progress. Each item carries its page URL and when it last
// changed, so the service worker fetches only pages it does not have or that changed.
//
// Whose subsystems: a member or alumnus gets the subsystems of every season membership they have had; a lead or
// advisor looks across the whole team, so they get every subsystem.
//
// `version` is `<milliseconds>-<scope>`: the moment the pack was read (taken before reading, so a write at that
// moment is sent again rather than missed) and a short hash of the person's subsystems. With `?since=<version>` the
// answer holds only what changed at or after that moment, plus `removed`: records and calculations deleted (drafts
// discarded) or moved out of the person's subsystems. A `since` from another scope (a membership was added or
// ended) gets the whole pack again (`full: true`). Guides' text and the calculators change only with a new build;
// a new build installs a new service worker, which asks for the whole pack.
import { createHash } from 'node:crypto';
import { and, eq, gte, inArray, isNotNull, isNull, max, notInArray, or, sql, type SQL } from 'drizzle-orm';
import type { Role } from '../domain';
import type { PackAnswer, PackCalculation, PackGuide, PackOnboarding, PackRecord } from '../offline/pack-merge';
import { calculators } from '../calc';
import { db } from './db/client';
import {
  calculations,
  comments,
  membershipSubsystems,
  records,
  seasonMemberships,
  seasons,
  subsystems,
} from './db/schema';
import { listGuides } from './guides';
import { getRoute } from './onboarding';

export interface PackCaller {
  id: string;
  role: Role;
}

/** A version as the API hands it out: when, and whose scope. */
export const PACK_VERSION = /^(\d{1,15})-([0-9a-f]{8})$/;

/** Leads and advisors look across the team; members and alumni keep what they own or owned. */
function scopeOf(caller: PackCaller): { rule: 'memberships' | 'all'; subsystems: string[] } {
  if (caller.role === 'lead' || caller.role === 'advisor') {
    const all = db().select({ slug: subsystems.slug }).from(subsystems).orderBy(subsystems.position).all();
    return { rule: 'all', subsystems: all.map((s) => s.slug) };
  }
  const owned = db()
    .selectDistinct({ slug: membershipSubsystems.subsystemSlug })
    .from(seasonMemberships)
    .innerJoin(membershipSubsystems, eq(membershipSubsystems.membershipId, seasonMemberships.id))
    .where(eq(seasonMemberships.userId, caller.id))
    .all();
  return { rule: 'memberships', subsystems: owned.map((s) => s.slug).sort() };
}

const scopeHash = (scope: { rule: string; subsystems: string[] }) =>
  createHash('sha256')
    .update(`${scope.rule}:${scope.subsystems.join(',')}`)
    .digest('hex')
    .slice(0, 8);

/** The newest comment activity per record: a question or an answer changes the record's page too. */
function commentActivity() {
  return db()
    .select({
      recordId: comments.recordId,
      at: max(
        sql<number>`max(${comments.createdAt}, coalesce(${comments.editedAt}, 0), coalesce(${comments.answeredAt}, 0))`,
      ).as('at'),
    })
    .from(comments)
    .groupBy(comments.recordId)
    .as('activity');
}

const iso = (ms: number | Date) => new Date(ms).toISOString();

function packRecords(scope: string[], since: number | null): PackRecord[] {
  const activity = commentActivity();
  const changedAt = sql<number>`max(${records.updatedAt}, coalesce(${activity.at}, 0))`;
  const where: SQL[] = [isNull(records.deletedAt), inArray(records.subsystemSlug, scope)];
  if (since !== null) where.push(sql`${changedAt} >= ${since}`);
  return db()
    .select({
      id: records.id,
      kind: records.kind,
      title: records.title,
      subsystem: records.subsystemSlug,
      season: seasons.name,
      status: records.status,
      changedAt,
    })
    .from(records)
    .innerJoin(seasons, eq(seasons.id, records.seasonId))
    .leftJoin(activity, eq(activity.recordId, records.id))
    .where(and(...where))
    .orderBy(sql`${changedAt} desc`)
    .all()
    .map(({ changedAt: at, ...r }) => ({ ...r, url: `/records/${r.id}`, updatedAt: iso(at) }));
}

function packCalculations(scope: string[], since: number | null): PackCalculation[] {
  const where: SQL[] = [isNull(calculations.deletedAt), inArray(calculations.subsystemSlug, scope)];
  if (since !== null) where.push(gte(calculations.updatedAt, new Date(since)));
  return db()
    .select({
      id: calculations.id,
      kind: calculations.kind,
      title: calculations.title,
      subsystem: calculations.subsystemSlug,
      season: seasons.name,
      updatedAt: calculations.updatedAt,
    })
    .from(calculations)
    .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
    .where(and(...where))
    .all()
    .map((c) => ({ ...c, url: `/calculations/${c.id}`, updatedAt: iso(c.updatedAt) }));
}

/** Records and calculations a browser may keep that it should drop: deleted, or moved out of the scope. */
function packRemovals(scope: string[], since: number): { id: string; url: string }[] {
  const at = new Date(since);
  const gone = <T extends typeof records | typeof calculations>(t: T) =>
    or(
      and(isNotNull(t.deletedAt), gte(t.deletedAt, at)),
      and(isNull(t.deletedAt), gte(t.updatedAt, at), notInArray(t.subsystemSlug, scope)),
    );
  const recordIds = db().select({ id: records.id }).from(records).where(gone(records)).all();
  const calculationIds = db().select({ id: calculations.id }).from(calculations).where(gone(calculations)).all();
  return [
    ...recordIds.map(({ id }) => ({ id, url: `/records/${id}` })),
    ...calculationIds.map(({ id }) => ({ id, url: `/calculations/${id}` })),
  ];
}

async function packGuides(since: number | null): Promise<PackGuide[]> {
  return (
    (await listGuides())
      .map((g) => ({
        slug: g.slug,
        title: g.title,
        subsystem: g.subsystem,
        url: g.url,
        updatedAt: `${g.reviewedOn}T00:00:00.000Z`,
      }))
      // A review is kept as a day: one made on the day of `since` (or later) counts as a change.
      .filter((g) => since === null || g.updatedAt.slice(0, 10) >= iso(since).slice(0, 10))
  );
}

/** The person's routes, always whole: ticks taken back leave no time behind, and a route is a few lines. */
async function packOnboarding(callerId: string, scope: string[], now: number): Promise<PackOnboarding[]> {
  const names = new Map(
    db()
      .select({ slug: subsystems.slug, name: subsystems.name })
      .from(subsystems)
      .all()
      .map((s) => [s.slug, s.name]),
  );
  const out: PackOnboarding[] = [];
  for (const slug of scope) {
    const route = await getRoute(slug, callerId);
    if (route.items.length === 0) continue;
    out.push({
      subsystem: slug,
      url: `/subsystems/${slug}`,
      title: `${names.get(slug) ?? slug}: onboarding route`,
      updatedAt: iso(now),
      progress: route.progress,
      items: route.items.map((i) => ({ id: i.id, kind: i.kind, title: i.title, url: i.url, done: i.done })),
    });
  }
  return out;
}

export async function offlinePack(caller: PackCaller, since?: string): Promise<PackAnswer> {
  const now = Date.now();
  const scope = scopeOf(caller);
  const hash = scopeHash(scope);
  const from = since ? PACK_VERSION.exec(since) : null;
  const incremental = !!from && from[2] === hash;
  const sinceMs = incremental ? Number(from[1]) : null;
  return {
    version: `${now}-${hash}`,
    person: caller.id,
    full: !incremental,
    scope,
    guides: await packGuides(sinceMs),
    records: packRecords(scope.subsystems, sinceMs),
    calculations: packCalculations(scope.subsystems, sinceMs),
    calculators: incremental
      ? []
      : Object.values(calculators).map((c) => ({
          kind: c.kind,
          title: c.title,
          url: `/calculations/new/${c.kind}`,
          updatedAt: iso(now),
        })),
    onboarding: await packOnboarding(caller.id, scope.subsystems, now),
    removed: sinceMs === null ? [] : packRemovals(scope.subsystems, sinceMs),
  };
}
