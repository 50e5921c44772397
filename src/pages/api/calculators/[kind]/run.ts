import type { APIRoute } from 'astro';
import { handle, json, notFound, readJson, requirePermission } from '~/lib/server/http';
import { getCalculator } from '~/lib/calc';
import { runCalculatorInputSchema } from '~/lib/schemas/calculations';
import { computeOrThrow } from '~/lib/server/calculations';

/** Computes without saving anything. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  requirePermission(locals, 'read');
  const kind = params.kind ?? '';
  if (!getCalculator(kind)) throw notFound('That calculator');
  const { inputs } = await readJson(request, runCalculatorInputSchema, 32 * 1024);
  const run = computeOrThrow(kind, inputs);
  return json({
    inputs: run.inputs,
    outputs: run.result.outputs,
    series: run.result.series ?? null,
    grid: run.result.grid ?? null,
    warnings: run.result.warnings,
    engineVersion: run.engineVersion,
  });
});
