import type { APIRoute } from 'astro';
import { handle, json, notFound, requirePermission } from '~/lib/server/http';
import { getCalculation } from '~/lib/server/calculations';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const calculation = getCalculation(params.id ?? '');
  if (!calculation) throw notFound('That calculation');
  return json({ calculation });
});
