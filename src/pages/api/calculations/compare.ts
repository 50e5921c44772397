import type { APIRoute } from 'astro';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { compareQuerySchema } from '~/lib/schemas/calculations';
import { compareCalculations } from '~/lib/server/calculations';

export const GET: APIRoute = handle(({ locals, url }) => {
  requirePermission(locals, 'read');
  const { a, b } = parseQuery(url, compareQuerySchema);
  return json(compareCalculations(a, b));
});
