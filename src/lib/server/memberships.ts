import { and, eq, asc } from 'drizzle-orm';
import { db } from './db/client';
import { seasonMemberships, membershipSubsystems, subsystems } from './db/schema';

/** The subsystems a person owns in one season, in the team's order. */
export function subsystemsOf(userId: string, seasonId: string) {
  return db()
    .select({ slug: subsystems.slug, name: subsystems.name, summary: subsystems.summary })
    .from(seasonMemberships)
    .innerJoin(membershipSubsystems, eq(membershipSubsystems.membershipId, seasonMemberships.id))
    .innerJoin(subsystems, eq(subsystems.slug, membershipSubsystems.subsystemSlug))
    .where(and(eq(seasonMemberships.userId, userId), eq(seasonMemberships.seasonId, seasonId)))
    .orderBy(asc(subsystems.position))
    .all();
}
