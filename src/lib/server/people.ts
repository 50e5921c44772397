import { asc, eq, sql } from 'drizzle-orm';
import { db, prepared } from './db/client';
import type { Role } from '../domain';
import { users, seasons, seasonMemberships, membershipSubsystems, subsystems } from './db/schema';

export interface PersonSeason {
  seasonId: string;
  season: string;
  role: Role;
  subsystems: { slug: string; name: string }[];
}

export interface PersonView {
  id: string;
  name: string;
  email: string;
  role: Role;
  lastSignInAt: string | null;
  seasons: PersonSeason[];
}

/** Everyone with their seasons and the subsystems they owned in each, newest season first. */
export function listPeople(): PersonView[] {
  const rows = db()
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: users.role,
      lastSignInAt: users.lastSignInAt,
      membershipId: seasonMemberships.id,
      seasonId: seasons.id,
      season: seasons.name,
      startsOn: seasons.startsOn,
      seasonRole: seasonMemberships.role,
    })
    .from(users)
    .leftJoin(seasonMemberships, eq(seasonMemberships.userId, users.id))
    .leftJoin(seasons, eq(seasons.id, seasonMemberships.seasonId))
    .orderBy(asc(users.name))
    .all();
  const owned = db()
    .select({ membershipId: membershipSubsystems.membershipId, slug: subsystems.slug, name: subsystems.name })
    .from(membershipSubsystems)
    .innerJoin(subsystems, eq(subsystems.slug, membershipSubsystems.subsystemSlug))
    .orderBy(asc(subsystems.position))
    .all();
  const byMembership = new Map<string, { slug: string; name: string }[]>();
  for (const o of owned)
    byMembership.set(o.membershipId, [...(byMembership.get(o.membershipId) ?? []), { slug: o.slug, name: o.name }]);

  const people = new Map<string, PersonView & { starts: Map<string, string> }>();
  for (const r of rows) {
    let p = people.get(r.userId);
    if (!p) {
      p = {
        id: r.userId,
        name: r.name,
        email: r.email,
        role: r.role,
        lastSignInAt: r.lastSignInAt?.toISOString() ?? null,
        seasons: [],
        starts: new Map(),
      };
      people.set(r.userId, p);
    }
    if (r.membershipId && r.seasonId && r.season && r.seasonRole) {
      p.seasons.push({
        seasonId: r.seasonId,
        season: r.season,
        role: r.seasonRole,
        subsystems: byMembership.get(r.membershipId) ?? [],
      });
      p.starts.set(r.seasonId, r.startsOn ?? '');
    }
  }
  return [...people.values()].map(({ starts, ...p }) => ({
    ...p,
    seasons: p.seasons.sort((a, b) => (starts.get(b.seasonId) ?? '').localeCompare(starts.get(a.seasonId) ?? '')),
  }));
}

/** Who owns each subsystem in one season: slug → names. */
export function ownersBySubsystem(seasonId: string): Map<string, { id: string; name: string }[]> {
  const rows = prepared('people.ownersBySubsystem', (d) =>
    d
      .select({ slug: membershipSubsystems.subsystemSlug, id: users.id, name: users.name })
      .from(membershipSubsystems)
      .innerJoin(seasonMemberships, eq(seasonMemberships.id, membershipSubsystems.membershipId))
      .innerJoin(users, eq(users.id, seasonMemberships.userId))
      .where(eq(seasonMemberships.seasonId, sql.placeholder('seasonId')))
      .orderBy(asc(users.name))
      .prepare(),
  ).all({ seasonId });
  const out = new Map<string, { id: string; name: string }[]>();
  for (const r of rows) out.set(r.slug, [...(out.get(r.slug) ?? []), { id: r.id, name: r.name }]);
  return out;
}
