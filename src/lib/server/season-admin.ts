import { and, eq, inArray, ne } from 'drizzle-orm';
import type { SeasonPhase } from '../domain';
import { db } from './db/client';
import { membershipSubsystems, seasonMemberships, seasons, subsystems, users } from './db/schema';
import { conflict, invalidInput, notFound } from './http';
import { newId } from './ids';
import { recordAudit } from './audit';
import type { Season } from '../schemas/seasons';
import { currentSeason, findSeason } from './seasons';

type Actor = { id: string; email: string };

export function createSeason(
  input: { name: string; startsOn: string; endsOn: string; phase: SeasonPhase; boat?: string },
  actor: Actor,
): Season {
  if (db().select({ id: seasons.id }).from(seasons).where(eq(seasons.name, input.name)).get()) {
    throw conflict(`A season named “${input.name}” already exists.`);
  }
  const id = newId();
  const first = !currentSeason();
  db()
    .insert(seasons)
    .values({
      id,
      name: input.name,
      startsOn: input.startsOn,
      endsOn: input.endsOn,
      phase: input.phase,
      isCurrent: first,
      boat: input.boat ?? null,
      createdAt: new Date(),
    })
    .run();
  recordAudit({ actor, action: 'season.create', targetType: 'season', targetId: id, detail: { name: input.name } });
  return findSeason(id)!;
}

export function updateSeason(
  id: string,
  patch: {
    name?: string;
    startsOn?: string;
    endsOn?: string;
    phase?: SeasonPhase;
    boat?: string | null;
    current?: true;
  },
  actor: Actor,
): Season {
  const s = findSeason(id);
  if (!s) throw notFound('That season');
  const startsOn = patch.startsOn ?? s.startsOn;
  const endsOn = patch.endsOn ?? s.endsOn;
  if (endsOn <= startsOn) throw invalidInput([{ path: 'endsOn', message: 'The season must end after it starts.' }]);
  if (
    patch.name &&
    patch.name !== s.name &&
    db()
      .select({ id: seasons.id })
      .from(seasons)
      .where(and(eq(seasons.name, patch.name), ne(seasons.id, id)))
      .get()
  ) {
    throw conflict(`A season named “${patch.name}” already exists.`);
  }
  db().transaction((tx) => {
    if (patch.current) tx.update(seasons).set({ isCurrent: false }).where(eq(seasons.isCurrent, true)).run();
    tx.update(seasons)
      .set({
        name: patch.name ?? s.name,
        startsOn,
        endsOn,
        phase: patch.phase ?? s.phase,
        boat: patch.boat === undefined ? s.boat : patch.boat,
        ...(patch.current ? { isCurrent: true } : {}),
      })
      .where(eq(seasons.id, id))
      .run();
  });
  recordAudit({
    actor,
    action: patch.current ? 'season.make-current' : 'season.update',
    targetType: 'season',
    targetId: id,
    detail: patch,
  });
  return findSeason(id)!;
}

export interface RolloverChange {
  userId: string;
  name: string;
  change: 'to-alumni' | 'continues';
  /** Slugs of the subsystems they own in the current season. */
  subsystems: string[];
  /** The same subsystems by name, for the confirmation screen. */
  subsystemNames: string[];
}

/**
 * Rolls over from the current season to `toId`, which must start after the current one: members who continue
 * join the new season with their subsystems; the other members become alumni. Leads and advisors keep their
 * roles. `continuing` left out means every member of the current season continues. Without `confirm` nothing is
 * written and the exact list of changes is returned for the confirmation screen.
 */
export function rollover(toId: string, continuingIn: string[] | undefined, confirm: boolean, actor: Actor) {
  const to = findSeason(toId);
  if (!to) throw notFound('That season');
  const from = currentSeason();
  if (!from) throw conflict('No season is current, so there is nothing to roll over from.');
  if (from.id === to.id) throw conflict('That season is already the current one.');
  if (to.startsOn <= from.startsOn)
    throw conflict(
      `${to.name} starts on ${to.startsOn}, before ${from.name} (${from.startsOn}); roll over only to a later season.`,
    );
  const members = db()
    .select({
      membershipId: seasonMemberships.id,
      userId: users.id,
      name: users.name,
      role: users.role,
      seasonRole: seasonMemberships.role,
    })
    .from(seasonMemberships)
    .innerJoin(users, eq(users.id, seasonMemberships.userId))
    .where(eq(seasonMemberships.seasonId, from.id))
    .all()
    .filter((m) => m.role === 'member');
  const continuing = continuingIn ?? members.map((m) => m.userId);
  const unknown = continuing.filter((id) => !members.some((m) => m.userId === id));
  if (unknown.length)
    throw invalidInput(unknown.map((u) => ({ path: 'continuing', message: `${u} is not a member of ${from.name}.` })));
  const owned = members.length
    ? db()
        .select({
          membershipId: membershipSubsystems.membershipId,
          slug: membershipSubsystems.subsystemSlug,
          name: subsystems.name,
        })
        .from(membershipSubsystems)
        .innerJoin(subsystems, eq(subsystems.slug, membershipSubsystems.subsystemSlug))
        .where(
          inArray(
            membershipSubsystems.membershipId,
            members.map((m) => m.membershipId),
          ),
        )
        .all()
    : [];
  const changes: RolloverChange[] = members.map((m) => ({
    userId: m.userId,
    name: m.name,
    change: continuing.includes(m.userId) ? 'continues' : 'to-alumni',
    subsystems: owned.filter((o) => o.membershipId === m.membershipId).map((o) => o.slug),
    subsystemNames: owned.filter((o) => o.membershipId === m.membershipId).map((o) => o.name),
  }));
  const summary = { from: from.name, to: to.name, changes };
  if (!confirm) return { applied: false, ...summary };
  db().transaction((tx) => {
    for (const c of changes) {
      if (c.change === 'to-alumni') tx.update(users).set({ role: 'alumni' }).where(eq(users.id, c.userId)).run();
      else {
        const exists = tx
          .select({ id: seasonMemberships.id })
          .from(seasonMemberships)
          .where(and(eq(seasonMemberships.seasonId, to.id), eq(seasonMemberships.userId, c.userId)))
          .get();
        const membershipId = exists?.id ?? newId();
        if (!exists)
          tx.insert(seasonMemberships)
            .values({ id: membershipId, seasonId: to.id, userId: c.userId, role: 'member' })
            .run();
        for (const slug of c.subsystems)
          tx.insert(membershipSubsystems).values({ membershipId, subsystemSlug: slug }).onConflictDoNothing().run();
      }
    }
    tx.update(seasons).set({ isCurrent: false }).where(eq(seasons.isCurrent, true)).run();
    tx.update(seasons).set({ isCurrent: true }).where(eq(seasons.id, to.id)).run();
  });
  recordAudit({
    actor,
    action: 'season.rollover',
    targetType: 'season',
    targetId: to.id,
    detail: {
      from: from.name,
      toAlumni: changes.filter((c) => c.change === 'to-alumni').length,
      continuing: continuing.length,
    },
  });
  return { applied: true, ...summary };
}
