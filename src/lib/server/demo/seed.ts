import { count } from 'drizzle-orm';
import { db } from '../db/client';
import { users, seasons, subsystems, seasonMemberships, membershipSubsystems } from '../db/schema';
import { hashPassword } from '../auth/password';
import { newId } from '../ids';
import { loadDemoTeam, demoDir, DEMO_PASSWORD, type DemoTeam } from './team';
import { loadDemoCalculations, seedCalculations } from './calculations';
import { loadDemoAttachments, loadDemoRecords, seedRecords } from './records';
import { loadDemoOnboarding, seedOnboarding } from './onboarding';
import type { SeedIds, Tx } from './seed-types';
import { recordAudit } from '../audit';

/** Seeds the fictional demo team into an empty database. With any user present it does nothing. */
export async function seedDemoIfEmpty(): Promise<boolean> {
  const [{ n }] = db().select({ n: count() }).from(users).all();
  if (n > 0) return false;
  const dir = demoDir();
  const team = loadDemoTeam(dir);
  const calcs = loadDemoCalculations(dir);
  const recs = loadDemoRecords(dir);
  const files = await loadDemoAttachments(dir, recs);
  const onboarding = loadDemoOnboarding(dir);
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  db().transaction((tx) => {
    // A second process may have seeded between our count and this transaction.
    const [{ n: again }] = tx.select({ n: count() }).from(users).all();
    if (again > 0) return;
    const ids = seedTeam(tx, team, passwordHash);
    seedCalculations(tx, ids, calcs);
    seedRecords(tx, ids, files, recs, new Map(calcs.map((c) => [c.id, c.title])));
    seedOnboarding(tx, ids, onboarding);
  });
  recordAudit({ actor: null, action: 'demo.seed', targetType: 'database' });
  return true;
}

function seedTeam(tx: Tx, team: DemoTeam, passwordHash: string): SeedIds {
  const now = new Date();
  const seasonIdByName = new Map<string, string>();
  for (const s of team.seasons) {
    const id = newId();
    seasonIdByName.set(s.name, id);
    tx.insert(seasons)
      .values({
        id,
        name: s.name,
        startsOn: s.startsOn,
        endsOn: s.endsOn,
        phase: s.phase,
        isCurrent: s.current,
        boat: s.boat ?? null,
        createdAt: now,
      })
      .run();
  }
  team.subsystems.forEach((s, position) => {
    tx.insert(subsystems)
      .values({
        slug: s.slug,
        name: s.name,
        summary: s.summary,
        calculationsApply: s.calculationsApply,
        position,
        createdAt: now,
      })
      .run();
  });
  const userIdByEmail = new Map<string, string>();
  for (const p of team.people) {
    const id = newId();
    userIdByEmail.set(p.email, id);
    tx.insert(users)
      .values({ id, email: p.email, name: p.name, role: p.role, passwordHash, createdAt: now, digestOptIn: false })
      .run();
    for (const m of p.seasons) {
      const seasonId = seasonIdByName.get(m.season);
      if (!seasonId) throw new Error(`demo person ${p.email}: unknown season ${m.season}`);
      const membershipId = newId();
      tx.insert(seasonMemberships).values({ id: membershipId, seasonId, userId: id, role: m.role }).run();
      for (const slug of m.subsystems)
        tx.insert(membershipSubsystems).values({ membershipId, subsystemSlug: slug }).run();
    }
  }
  return { seasonIdByName, userIdByEmail };
}
