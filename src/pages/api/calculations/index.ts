import type { APIRoute } from 'astro';
import { handle, json, parseQuery, readJson, requirePermission } from '~/lib/server/http';
import { calculationInputSchema, calculationListQuerySchema } from '~/lib/schemas/calculations';
import { createCalculation, listCalculations } from '~/lib/server/calculations';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const q = parseQuery(url, calculationListQuerySchema);
  return json(
    listCalculations({
      subsystem: q.subsystem || undefined,
      season: q.season || undefined,
      kind: q.kind || undefined,
      limit: q.limit,
      cursor: q.cursor,
    }),
  );
});

/** Saves a calculation; outputs are always computed here (any outputs the client sends are ignored). */
export const POST: APIRoute = handle(async ({ locals, request }) => {
  // Refuses at once whoever may not file anywhere; the chosen season is checked once the body names it.
  const user = requirePermission(locals, 'calculation:create', { seasonIsCurrent: true });
  const input = await readJson(request, calculationInputSchema, 64 * 1024);
  return json({ calculation: createCalculation(input, user) }, 201);
});
