import { and, desc, eq, inArray, isNull, lt, notInArray, or, sql, type SQL } from 'drizzle-orm';
import { db, prepared } from './db/client';
import { calculations, calculationResults, recordCalculations, records, seasons, subsystems, users } from './db/schema';
import { getCalculator, runCalculator, type CalcResult } from '../calc';
import { OutOfRangeError } from '../calc/errors';
import { conflict, HttpError, invalidInput, notFound } from './http';
import { newId } from './ids';
import { recordAudit } from './audit';
import { currentSeason, findSeason, findSubsystem } from './seasons';
import type { CalculationInput, CalculationPatch } from '../schemas/calculations';
import { onCalculationChanged } from './records/hooks';
import { can } from '../policy';
import type { Role } from '../domain';
import { decodeCursor, encodeCursor } from './cursor';

type Actor = { id: string; email: string; role: Role };
type Outputs = Record<string, number | string | null>;

export interface CalculationResultView {
  id: string;
  engineVersion: string;
  computedAt: string;
  outputs: Outputs;
  warnings: string[];
}

export interface CalculationView {
  id: string;
  kind: string;
  kindTitle: string;
  title: string;
  subsystem: string;
  subsystemName: string;
  seasonId: string;
  season: string;
  seasonIsCurrent: boolean;
  author: string | null;
  authorId: string | null;
  notes: string;
  inputs: Record<string, unknown>;
  outputs: Outputs;
  warnings: string[];
  series: CalcResult<Outputs>['series'] | null;
  grid: CalcResult<Outputs>['grid'] | null;
  grids: NonNullable<CalcResult<Outputs>['grids']>;
  engineVersion: string;
  currentEngineVersion: string | null;
  computedAt: string;
  createdAt: string;
  results: CalculationResultView[];
  records: { id: string; title: string; kind: string; status: string }[];
  url: string;
}

/** Runs a calculator and turns its failures into API errors (400 for the schema, 422 for the method's range). */
export function computeOrThrow(kind: string, rawInputs: unknown) {
  const calc = getCalculator(kind);
  if (!calc) throw notFound('That calculator');
  const run = runCalculator(kind, rawInputs);
  if (run.ok) return run;
  if (run.error === 'invalid_input')
    throw invalidInput(run.issues.map((i) => ({ path: i.path ? `inputs.${i.path}` : 'inputs', message: i.message })));
  throw new OutOfRangeError(run.input, run.message);
}

export function createCalculation(input: CalculationInput, actor: Actor): CalculationView {
  const run = computeOrThrow(input.kind, input.inputs);
  if (!findSubsystem(input.subsystem)) throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
  const season = input.seasonId ? findSeason(input.seasonId) : currentSeason();
  if (!season)
    throw invalidInput([
      { path: 'seasonId', message: input.seasonId ? 'No such season.' : 'No season is current; choose one.' },
    ]);
  if (!can(actor, 'calculation:create', { seasonIsCurrent: season.current }))
    throw new HttpError(403, 'forbidden', 'Members file calculations into the current season only.');
  const id = newId();
  const now = new Date();
  db().transaction((tx) => {
    tx.insert(calculations)
      .values({
        id,
        kind: input.kind,
        title: input.title,
        subsystemSlug: input.subsystem,
        seasonId: season.id,
        authorId: actor.id,
        notes: input.notes,
        inputs: run.inputs,
        createdAt: now,
        updatedAt: now,
      })
      .run();
    insertResult(tx, id, run, actor.id, now);
  });
  recordAudit({
    actor,
    action: 'calculation.create',
    targetType: 'calculation',
    targetId: id,
    detail: { kind: input.kind, title: input.title },
  });
  onCalculationChanged(id);
  return getCalculation(id)!;
}

type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];

function insertResult(
  tx: Tx,
  calculationId: string,
  run: ReturnType<typeof computeOrThrow>,
  actorId: string | null,
  at: Date,
) {
  tx.insert(calculationResults)
    .values({
      id: newId(),
      calculationId,
      engineVersion: run.engineVersion,
      outputs: run.result.outputs,
      series: { series: run.result.series ?? null, grid: run.result.grid ?? null, grids: run.result.grids ?? [] },
      warnings: run.result.warnings,
      computedById: actorId,
      computedAt: at,
    })
    .run();
}

/** Stores a new result with today's engine and keeps the earlier ones; returns what changed. */
export function recomputeCalculation(id: string, actor: Actor) {
  const before = getCalculation(id);
  if (!before) throw notFound('That calculation');
  if (!can(actor, 'calculation:recompute', { seasonIsCurrent: before.seasonIsCurrent }))
    throw new HttpError(403, 'forbidden', 'Members recompute calculations of the current season only.');
  const run = computeOrThrow(before.kind, before.inputs);
  const now = new Date();
  db().transaction((tx) => {
    insertResult(tx, id, run, actor.id, now);
    tx.update(calculations).set({ updatedAt: now }).where(eq(calculations.id, id)).run();
  });
  recordAudit({
    actor,
    action: 'calculation.recompute',
    targetType: 'calculation',
    targetId: id,
    detail: { from: before.engineVersion, to: run.engineVersion },
  });
  onCalculationChanged(id);
  const after = getCalculation(id)!;
  return { calculation: after, previous: before.results[0], changes: diffOutputs(before.outputs, after.outputs) };
}

/** The calculation as an edit needs it: who wrote it, whether its season is current, live or not. */
function loadForEdit(id: string, actor: Actor) {
  const row = db()
    .select({ authorId: calculations.authorId, title: calculations.title, seasonIsCurrent: seasons.isCurrent })
    .from(calculations)
    .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
    .where(and(eq(calculations.id, id), isNull(calculations.deletedAt)))
    .get();
  if (!row) throw notFound('That calculation');
  const subject = { seasonIsCurrent: row.seasonIsCurrent, isOwn: row.authorId === actor.id };
  if (!can(actor, 'calculation:edit', subject))
    throw new HttpError(
      403,
      'forbidden',
      'Only its author (in the current season) or a lead may change or delete a calculation.',
    );
  const accepted = db()
    .select({ id: records.id, title: records.title })
    .from(recordCalculations)
    .innerJoin(records, eq(records.id, recordCalculations.recordId))
    .where(
      and(
        eq(recordCalculations.calculationId, id),
        eq(records.kind, 'decision'),
        eq(records.status, 'accepted'),
        isNull(records.deletedAt),
      ),
    )
    .get();
  if (accepted)
    throw conflict(
      `The accepted decision record “${accepted.title}” rests on this calculation; it stays as it was. Save a new calculation instead.`,
      { recordId: accepted.id },
    );
  return row;
}

/** Renames, re-notes or moves a saved calculation (its inputs and results stay as computed). */
export function updateCalculation(id: string, patch: CalculationPatch, actor: Actor): CalculationView {
  loadForEdit(id, actor);
  if (patch.subsystem !== undefined && !findSubsystem(patch.subsystem))
    throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
  db()
    .update(calculations)
    .set({
      ...(patch.title !== undefined ? { title: patch.title } : {}),
      ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
      ...(patch.subsystem !== undefined ? { subsystemSlug: patch.subsystem } : {}),
      updatedAt: new Date(),
    })
    .where(eq(calculations.id, id))
    .run();
  recordAudit({
    actor,
    action: 'calculation.update',
    targetType: 'calculation',
    targetId: id,
    detail: { fields: Object.keys(patch).filter((k) => patch[k as keyof CalculationPatch] !== undefined) },
  });
  onCalculationChanged(id);
  return getCalculation(id)!;
}

/** Deletes a saved calculation: gone from lists, search, records' links, routes and the bundle; kept in the audit. */
export function deleteCalculation(id: string, actor: Actor): void {
  const row = loadForEdit(id, actor);
  const now = new Date();
  db().update(calculations).set({ deletedAt: now, updatedAt: now }).where(eq(calculations.id, id)).run();
  recordAudit({
    actor,
    action: 'calculation.delete',
    targetType: 'calculation',
    targetId: id,
    detail: { title: row.title },
  });
  onCalculationChanged(id);
}

export function diffOutputs(a: Outputs, b: Outputs) {
  const names = [...new Set([...Object.keys(a), ...Object.keys(b)])];
  return names
    .map((name) => ({ name, before: a[name] ?? null, after: b[name] ?? null }))
    .filter((c) => !sameValue(c.before, c.after));
}

function sameValue(x: unknown, y: unknown): boolean {
  if (typeof x === 'number' && typeof y === 'number')
    return x === y || Math.abs(x - y) <= 1e-12 * Math.max(1, Math.abs(x), Math.abs(y));
  return x === y;
}

export function getCalculation(id: string): CalculationView | null {
  const row = db()
    .select({
      c: calculations,
      subsystemName: subsystems.name,
      season: seasons.name,
      seasonIsCurrent: seasons.isCurrent,
      author: users.name,
    })
    .from(calculations)
    .innerJoin(subsystems, eq(subsystems.slug, calculations.subsystemSlug))
    .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
    .leftJoin(users, eq(users.id, calculations.authorId))
    .where(and(eq(calculations.id, id), isNull(calculations.deletedAt)))
    .get();
  if (!row) return null;
  const results = db()
    .select()
    .from(calculationResults)
    .where(eq(calculationResults.calculationId, id))
    .orderBy(desc(calculationResults.computedAt), desc(calculationResults.id))
    .all();
  const latest = results[0];
  const linked = db()
    .select({ id: records.id, title: records.title, kind: records.kind, status: records.status })
    .from(recordCalculations)
    .innerJoin(records, eq(records.id, recordCalculations.recordId))
    .where(and(eq(recordCalculations.calculationId, id), isNull(records.deletedAt)))
    .all();
  const stored = latest?.series ?? null;
  const c = row.c;
  return {
    id: c.id,
    kind: c.kind,
    kindTitle: getCalculator(c.kind)?.title ?? c.kind,
    title: c.title,
    subsystem: c.subsystemSlug,
    subsystemName: row.subsystemName,
    seasonId: c.seasonId,
    season: row.season,
    seasonIsCurrent: row.seasonIsCurrent,
    author: row.author,
    authorId: c.authorId,
    notes: c.notes,
    inputs: c.inputs,
    outputs: (latest?.outputs ?? {}) as Outputs,
    warnings: latest?.warnings ?? [],
    series: stored?.series ?? null,
    grid: stored?.grid ?? null,
    grids: stored?.grids ?? [],
    engineVersion: latest?.engineVersion ?? '',
    currentEngineVersion: getCalculator(c.kind)?.engineVersion ?? null,
    computedAt: (latest?.computedAt ?? c.createdAt).toISOString(),
    createdAt: c.createdAt.toISOString(),
    results: results.map((r) => ({
      id: r.id,
      engineVersion: r.engineVersion,
      computedAt: r.computedAt.toISOString(),
      outputs: r.outputs as Outputs,
      warnings: r.warnings,
    })),
    records: linked,
    url: `/calculations/${c.id}`,
  };
}

export interface CalculationListItem {
  id: string;
  kind: string;
  /** the calculator's name, as the rest of the app shows it */
  kindTitle: string;
  title: string;
  subsystem: string;
  subsystemName: string;
  seasonId: string;
  season: string;
  author: string | null;
  createdAt: string;
  url: string;
}

const p = (name: string) => sql.placeholder(name);

/** One prepared statement per combination of filters (at most 16), with the values as parameters. */
function calculationListQuery(shape: { subsystem: boolean; season: boolean; kind: boolean; cursor: boolean }) {
  const key = `calculations.list:${Object.values(shape).map(Number).join('')}`;
  return prepared(key, (d) => {
    const where: (SQL | undefined)[] = [isNull(calculations.deletedAt)];
    if (shape.subsystem) where.push(eq(calculations.subsystemSlug, p('subsystem')));
    if (shape.season) where.push(eq(calculations.seasonId, p('season')));
    if (shape.kind) where.push(eq(calculations.kind, p('kind')));
    if (shape.cursor)
      where.push(
        or(lt(calculations.createdAt, p('at')), and(eq(calculations.createdAt, p('at')), lt(calculations.id, p('id')))),
      );
    return d
      .select({
        id: calculations.id,
        kind: calculations.kind,
        title: calculations.title,
        subsystem: calculations.subsystemSlug,
        subsystemName: subsystems.name,
        seasonId: calculations.seasonId,
        season: seasons.name,
        author: users.name,
        createdAt: calculations.createdAt,
      })
      .from(calculations)
      .innerJoin(subsystems, eq(subsystems.slug, calculations.subsystemSlug))
      .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
      .leftJoin(users, eq(users.id, calculations.authorId))
      .where(and(...where))
      .orderBy(desc(calculations.createdAt), desc(calculations.id))
      .limit(p('limit'))
      .prepare();
  });
}

export function listCalculations(q: {
  subsystem?: string;
  season?: string;
  kind?: string;
  limit: number;
  cursor?: string;
}) {
  const c = decodeCursor(q.cursor);
  const shape = { subsystem: !!q.subsystem, season: !!q.season, kind: !!q.kind, cursor: !!c };
  // Placeholders reach SQLite as given: timestamps are stored as milliseconds, like the cursor carries them.
  const rows = calculationListQuery(shape).all({
    subsystem: q.subsystem,
    season: q.season,
    kind: q.kind,
    at: c?.at,
    id: c?.id,
    limit: q.limit + 1,
  });
  const page: CalculationListItem[] = rows.slice(0, q.limit).map((r) => ({
    ...r,
    kindTitle: getCalculator(r.kind)?.title ?? r.kind,
    createdAt: r.createdAt.toISOString(),
    url: `/calculations/${r.id}`,
  }));
  const last = page[page.length - 1];
  return {
    calculations: page,
    nextCursor: rows.length > q.limit && last ? encodeCursor(last.createdAt, last.id) : null,
  };
}

/** Two saved calculations side by side: every input and output with both values and whether they differ. */
export function compareCalculations(aId: string, bId: string) {
  const a = getCalculation(aId);
  const b = getCalculation(bId);
  if (!a || !b) throw notFound('One of those calculations');
  const rows = (x: Record<string, unknown>, y: Record<string, unknown>) =>
    [...new Set([...Object.keys(x), ...Object.keys(y)])].map((name) => ({
      name,
      a: x[name] ?? null,
      b: y[name] ?? null,
      differs: !sameValue(x[name] ?? null, y[name] ?? null),
    }));
  return { a, b, sameKind: a.kind === b.kind, inputs: rows(a.inputs, b.inputs), outputs: rows(a.outputs, b.outputs) };
}

/**
 * Records of the current season this person may edit and that do not link the calculation yet: the choices of
 * "link to a record" on a calculation page. Its own subsystem's records come first.
 */
export function linkableRecords(calculation: Pick<CalculationView, 'subsystem' | 'records'>, actor: Actor) {
  const season = currentSeason();
  if (!season || !can(actor, 'record:edit', { seasonIsCurrent: true })) return [];
  const linked = new Set(calculation.records.map((r) => r.id));
  const rows = db()
    .select({ id: records.id, title: records.title, subsystem: records.subsystemSlug, name: subsystems.name })
    .from(records)
    .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
    .where(
      and(
        eq(records.seasonId, season.id),
        isNull(records.deletedAt),
        notInArray(records.status, ['superseded', 'withdrawn']),
      ),
    )
    .orderBy(desc(records.updatedAt))
    .limit(200)
    .all()
    .filter((r) => !linked.has(r.id));
  const own = rows.filter((r) => r.subsystem === calculation.subsystem);
  const others = rows.filter((r) => r.subsystem !== calculation.subsystem);
  return [...own, ...others].map((r) => ({ id: r.id, title: r.title, note: r.name }));
}

export function existingCalculationIds(ids: string[]): Set<string> {
  if (ids.length === 0) return new Set();
  return new Set(
    db()
      .select({ id: calculations.id })
      .from(calculations)
      .where(and(inArray(calculations.id, ids), isNull(calculations.deletedAt)))
      .all()
      .map((r) => r.id),
  );
}
