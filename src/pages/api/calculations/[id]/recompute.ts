import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { recomputeCalculation } from '~/lib/server/calculations';

export const POST: APIRoute = handle(({ locals, params }) => {
  // Refuses at once whoever may recompute nothing; the calculation's own season is checked once it is found.
  const user = requirePermission(locals, 'calculation:recompute', { seasonIsCurrent: true });
  return json(recomputeCalculation(params.id ?? '', user));
});
