import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { db } from './db/client';
import { calculations, recordCalculations, records } from './db/schema';
import { listSubsystems, findSeason, currentSeason } from './seasons';
import { listGuides } from './guides';
import { getRoute } from './onboarding';
import { scoreReadiness, type Readiness } from '../readiness';
import { notFound } from './http';
import { memoUntilWrite } from './memo';

/** Gathers the handover facts of every subsystem for a season and scores them. */
export async function readinessFor(seasonId?: string, now = new Date()) {
  const season = seasonId ? findSeason(seasonId) : currentSeason();
  if (!season) throw notFound('That season');
  // Scores change with the data and, through guide review dates, with the day.
  return memoUntilWrite(`readiness:${season.id}:${now.toISOString().slice(0, 10)}`, () => score(season, now));
}

async function score(season: NonNullable<ReturnType<typeof findSeason>>, now: Date) {
  const guides = await listGuides();
  const out: ({ slug: string; name: string } & Readiness)[] = [];
  for (const s of listSubsystems()) {
    const recs = db()
      // Words counted in SQL (spaces and line breaks between non-empty text), so record bodies never leave the database here.
      .select({
        id: records.id,
        title: records.title,
        kind: records.kind,
        status: records.status,
        words: sql<number>`(length(trim(replace(${records.bodyText}, char(10), ' '))) - length(replace(trim(replace(${records.bodyText}, char(10), ' ')), ' ', '')) + (trim(${records.bodyText}) != ''))`,
      })
      .from(records)
      .where(and(eq(records.subsystemSlug, s.slug), eq(records.seasonId, season.id), isNull(records.deletedAt)))
      .all();
    const accepted = recs.filter((r) => r.kind === 'decision' && r.status === 'accepted');
    const calcCounts = new Map<string, number>();
    if (accepted.length) {
      for (const l of db()
        .select({ recordId: recordCalculations.recordId })
        .from(recordCalculations)
        .innerJoin(calculations, eq(calculations.id, recordCalculations.calculationId))
        .where(
          and(
            inArray(
              recordCalculations.recordId,
              accepted.map((a) => a.id),
            ),
            isNull(calculations.deletedAt),
          ),
        )
        .all()) {
        calcCounts.set(l.recordId, (calcCounts.get(l.recordId) ?? 0) + 1);
      }
    }
    const route = await getRoute(s.slug, null);
    const onRoute = new Set(route.items.filter((i) => i.kind === 'record').map((i) => i.ref));
    const result = scoreReadiness(
      {
        calculationsApply: s.calculationsApply,
        acceptedDecisions: accepted.map((d) => ({
          id: d.id,
          title: d.title,
          reasoningWords: d.words,
          calculations: calcCounts.get(d.id) ?? 0,
        })),
        lessons: recs
          .filter((r) => r.kind === 'lesson')
          .map((l) => ({ id: l.id, title: l.title, status: l.status, onRoute: onRoute.has(l.id) })),
        route: {
          items: route.items.length,
          itemsFromSeason: route.items.filter((i) => i.seasonId === season.id).length,
          missingItems: route.items.filter((i) => !i.exists).length,
        },
        guides: guides
          .filter((g) => g.subsystem === s.slug)
          .map((g) => ({ slug: g.slug, title: g.title, reviewedOn: g.reviewedOn })),
      },
      now,
    );
    out.push({ slug: s.slug, name: s.name, ...result });
  }
  return { season, subsystems: out };
}
