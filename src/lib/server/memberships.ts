import { and, eq, asc, sql } from 'drizzle-orm';
import { prepared } from './db/client';
import { seasonMemberships, membershipSubsystems, subsystems } from './db/schema';

/** The subsystems a person owns in one season, in the team's order (prepared once: the home page asks every time). */
export function subsystemsOf(userId: string, seasonId: string) {
  return prepared('memberships.subsystemsOf', (d) =>
    d
      .select({ slug: subsystems.slug, name: subsystems.name, summary: subsystems.summary })
      .from(seasonMemberships)
      .innerJoin(membershipSubsystems, eq(membershipSubsystems.membershipId, seasonMemberships.id))
      .innerJoin(subsystems, eq(subsystems.slug, membershipSubsystems.subsystemSlug))
      .where(
        and(
          eq(seasonMemberships.userId, sql.placeholder('user')),
          eq(seasonMemberships.seasonId, sql.placeholder('season')),
        ),
      )
      .orderBy(asc(subsystems.position))
      .prepare(),
  ).all({ user: userId, season: seasonId });
}
