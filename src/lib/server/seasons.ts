import { asc, desc, eq, sql } from 'drizzle-orm';
import type { Season } from '../schemas/seasons';
import { prepared } from './db/client';
import { seasons, subsystems } from './db/schema';

function toView(s: typeof seasons.$inferSelect): Season {
  return {
    id: s.id,
    name: s.name,
    startsOn: s.startsOn,
    endsOn: s.endsOn,
    phase: s.phase,
    current: s.isCurrent,
    boat: s.boat,
  };
}

/** Newest season first. */
export function listSeasons(): Season[] {
  return prepared('listSeasons', (d) => d.select().from(seasons).orderBy(desc(seasons.startsOn)).prepare())
    .all()
    .map(toView);
}

export function currentSeason(): Season | null {
  // A literal 1, not a bound value: with a parameter SQLite cannot know that the partial index on is_current = 1
  // applies, and prepares the statement again on every call.
  const s = prepared('currentSeason', (d) =>
    d
      .select()
      .from(seasons)
      .where(sql`${seasons.isCurrent} = 1`)
      .prepare(),
  ).get();
  return s ? toView(s) : null;
}

export function findSeason(id: string): Season | null {
  const s = prepared('findSeason', (d) =>
    d
      .select()
      .from(seasons)
      .where(eq(seasons.id, sql.placeholder('id')))
      .prepare(),
  ).get({ id });
  return s ? toView(s) : null;
}

export interface SubsystemView {
  slug: string;
  name: string;
  summary: string;
  /** Whether calculators apply here, so readiness expects accepted decisions to link a calculation. */
  calculationsApply: boolean;
}

export function listSubsystems(): SubsystemView[] {
  return prepared('listSubsystems', (d) =>
    d
      .select({
        slug: subsystems.slug,
        name: subsystems.name,
        summary: subsystems.summary,
        calculationsApply: subsystems.calculationsApply,
      })
      .from(subsystems)
      .orderBy(asc(subsystems.position), asc(subsystems.name))
      .prepare(),
  ).all();
}

export function findSubsystem(slug: string): SubsystemView | null {
  const q = prepared('findSubsystem', (d) =>
    d
      .select({
        slug: subsystems.slug,
        name: subsystems.name,
        summary: subsystems.summary,
        calculationsApply: subsystems.calculationsApply,
      })
      .from(subsystems)
      .where(eq(subsystems.slug, sql.placeholder('slug')))
      .prepare(),
  );
  return q.get({ slug }) ?? null;
}
