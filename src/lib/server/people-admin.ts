import { and, count, eq, inArray } from 'drizzle-orm';
import { db } from './db/client';
import { membershipSubsystems, seasonMemberships, subsystems, users } from './db/schema';
import { conflict, invalidInput, notFound } from './http';
import { newId } from './ids';
import { recordAudit } from './audit';
import { currentSeason } from './seasons';
import { listPeople, type PersonView } from './people';
import type { PeopleQuery, PersonPatch } from '../schemas/people';

const ROLE_ORDER = { lead: 0, advisor: 1, member: 2, alumni: 3 } as const;

export interface PeoplePage {
  people: PersonView[];
  total: number;
  page: number;
  pages: number;
  perPage: number;
}

/** Filters, sorts and pages everyone in memory: a team has tens of people, not thousands. */
export function queryPeople(q: PeopleQuery): PeoplePage {
  const needle = q.q?.toLowerCase();
  const filtered = listPeople().filter((p) => {
    if (needle && !p.name.toLowerCase().includes(needle) && !p.email.toLowerCase().includes(needle)) return false;
    if (q.role && p.role !== q.role) return false;
    const seasons = q.season ? p.seasons.filter((s) => s.seasonId === q.season) : p.seasons;
    if (q.season && seasons.length === 0) return false;
    if (q.subsystem && !seasons.some((s) => s.subsystems.some((x) => x.slug === q.subsystem))) return false;
    return true;
  });
  const sign = q.dir === 'desc' ? -1 : 1;
  const byName = (a: PersonView, b: PersonView) => a.name.localeCompare(b.name);
  filtered.sort((a, b) => {
    let c = 0;
    if (q.sort === 'role') c = ROLE_ORDER[a.role] - ROLE_ORDER[b.role];
    else if (q.sort === 'email') c = a.email.localeCompare(b.email);
    else if (q.sort === 'lastSignIn') c = (a.lastSignInAt ?? '').localeCompare(b.lastSignInAt ?? '');
    return sign * (c || byName(a, b));
  });
  const pages = Math.max(1, Math.ceil(filtered.length / q.perPage));
  const page = Math.min(q.page, pages);
  return {
    people: filtered.slice((page - 1) * q.perPage, page * q.perPage),
    total: filtered.length,
    page,
    pages,
    perPage: q.perPage,
  };
}

export function getPerson(id: string): PersonView | null {
  return listPeople().find((p) => p.id === id) ?? null;
}

type Actor = { id: string; email: string };

/**
 * Changes a person's role and/or their subsystems in the current season, in one transaction. The team always
 * keeps at least one lead: demoting the last one is refused with 409.
 */
export function updatePerson(id: string, patch: PersonPatch, actor: Actor): PersonView {
  const user = db().select().from(users).where(eq(users.id, id)).get();
  if (!user) throw notFound('That person');
  const season = currentSeason();
  if (patch.subsystems !== undefined) {
    if (!season)
      throw invalidInput([{ path: 'subsystems', message: 'No season is current, so there is nothing to assign in.' }]);
    const slugs = patch.subsystems;
    const known = new Set(
      slugs.length
        ? db()
            .select({ slug: subsystems.slug })
            .from(subsystems)
            .where(inArray(subsystems.slug, slugs))
            .all()
            .map((s) => s.slug)
        : [],
    );
    const unknown = slugs.filter((s) => !known.has(s));
    if (unknown.length)
      throw invalidInput([{ path: 'subsystems', message: `No such subsystem: ${unknown.join(', ')}.` }]);
  }
  const newRole = patch.role ?? user.role;
  const roleChanged = newRole !== user.role;
  let previousSubsystems: string[] | null = null;
  db().transaction((tx) => {
    if (roleChanged && user.role === 'lead') {
      const [{ n }] = tx.select({ n: count() }).from(users).where(eq(users.role, 'lead')).all();
      if (n <= 1)
        throw conflict('This is the team’s last lead. Make someone else a lead first, then change this role.');
    }
    if (roleChanged) tx.update(users).set({ role: newRole }).where(eq(users.id, id)).run();
    if (!season) return;
    let membership = tx
      .select()
      .from(seasonMemberships)
      .where(and(eq(seasonMemberships.userId, id), eq(seasonMemberships.seasonId, season.id)))
      .get();
    if (!membership && patch.subsystems !== undefined) {
      membership = { id: newId(), seasonId: season.id, userId: id, role: newRole };
      tx.insert(seasonMemberships).values(membership).run();
    }
    if (!membership) return;
    if (roleChanged)
      tx.update(seasonMemberships).set({ role: newRole }).where(eq(seasonMemberships.id, membership.id)).run();
    if (patch.subsystems !== undefined) {
      previousSubsystems = tx
        .select({ slug: membershipSubsystems.subsystemSlug })
        .from(membershipSubsystems)
        .where(eq(membershipSubsystems.membershipId, membership.id))
        .all()
        .map((r) => r.slug);
      tx.delete(membershipSubsystems).where(eq(membershipSubsystems.membershipId, membership.id)).run();
      for (const slug of patch.subsystems)
        tx.insert(membershipSubsystems).values({ membershipId: membership.id, subsystemSlug: slug }).run();
    }
  });
  if (roleChanged) {
    recordAudit({
      actor,
      action: 'person.role-change',
      targetType: 'user',
      targetId: id,
      detail: { email: user.email, from: user.role, to: newRole },
    });
  }
  if (patch.subsystems !== undefined) {
    recordAudit({
      actor,
      action: 'person.subsystems',
      targetType: 'user',
      targetId: id,
      detail: { email: user.email, season: season?.name, from: previousSubsystems, to: patch.subsystems },
    });
  }
  return getPerson(id)!;
}
