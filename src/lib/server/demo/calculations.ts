import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import { runCalculator } from '../../calc';
import { calculations, calculationResults } from '../db/schema';
import { newId } from '../ids';
import type { SeedIds, Tx } from './seed-types';

const demoCalculationSchema = z.object({
  id: z.string().regex(/^demo-calc-[a-z0-9-]+$/),
  kind: z.string(),
  title: z.string(),
  subsystem: z.string(),
  season: z.string(),
  author: z.email(),
  createdAt: z.iso.datetime().or(z.iso.date()),
  notes: z.string().default(''),
  inputs: z.record(z.string(), z.unknown()),
});

export function loadDemoCalculations(dir: string) {
  const file = resolve(dir, 'calculations.json');
  if (!existsSync(file)) return [];
  return z.array(demoCalculationSchema).parse(JSON.parse(readFileSync(file, 'utf8')));
}

/** Saves each demo calculation with outputs computed by today's engine (never numbers typed into the file). */
export function seedCalculations(tx: Tx, ids: SeedIds, list: ReturnType<typeof loadDemoCalculations>): void {
  for (const c of list) {
    const run = runCalculator(c.kind, c.inputs);
    if (!run.ok) throw new Error(`demo calculation ${c.id} does not compute: ${JSON.stringify(run)}`);
    const seasonId = ids.seasonIdByName.get(c.season);
    if (!seasonId) throw new Error(`demo calculation ${c.id}: unknown season ${c.season}`);
    const at = new Date(c.createdAt);
    const authorId = ids.userIdByEmail.get(c.author) ?? null;
    tx.insert(calculations)
      .values({
        id: c.id,
        kind: c.kind,
        title: c.title,
        subsystemSlug: c.subsystem,
        seasonId,
        authorId,
        notes: c.notes,
        inputs: run.inputs,
        createdAt: at,
        updatedAt: at,
      })
      .run();
    tx.insert(calculationResults)
      .values({
        id: newId(),
        calculationId: c.id,
        engineVersion: run.engineVersion,
        outputs: run.result.outputs,
        series: { series: run.result.series ?? null, grid: run.result.grid ?? null },
        warnings: run.result.warnings,
        computedById: authorId,
        computedAt: at,
      })
      .run();
  }
}
