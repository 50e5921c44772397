import type { APIRoute } from 'astro';
import { handle, json, notFound, readJson, requirePermission } from '~/lib/server/http';
import { deleteCalculation, getCalculation, updateCalculation } from '~/lib/server/calculations';
import { calculationPatchSchema } from '~/lib/schemas/calculations';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const calculation = getCalculation(params.id ?? '');
  if (!calculation) throw notFound('That calculation');
  return json({ calculation });
});

/** Rename, re-note or move: its author (current season) or a lead; refused while an accepted decision rests on it. */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  // Refuses at once whoever may change no calculation; authorship and season are checked once it is found.
  const user = requirePermission(locals, 'calculation:edit', { seasonIsCurrent: true, isOwn: true });
  const patch = await readJson(request, calculationPatchSchema, 64 * 1024);
  return json({ calculation: updateCalculation(params.id ?? '', patch, user) });
});

export const DELETE: APIRoute = handle(({ locals, params }) => {
  const user = requirePermission(locals, 'calculation:edit', { seasonIsCurrent: true, isOwn: true });
  deleteCalculation(params.id ?? '', user);
  return json(null, 204);
});
