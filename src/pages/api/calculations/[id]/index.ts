import type { APIRoute } from 'astro';
import { handle, json, notFound, requirePermission } from '~/lib/server/http';
import { getCalculation } from '~/lib/server/calculations';

export const GET: APIRoute = handle(({ locals, params }) => {
  requirePermission(locals, 'read');
  const calculation = getCalculation(params.id ?? '');
  if (!calculation) throw notFound('That calculation');
  return json({ calculation });
});
