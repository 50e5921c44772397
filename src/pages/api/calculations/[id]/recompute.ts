import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { recomputeCalculation } from '~/lib/server/calculations';

export const POST: APIRoute = handle(({ locals, params }) => {
  const user = requirePermission(locals, 'calculation:recompute');
  return json(recomputeCalculation(params.id ?? '', user));
});
