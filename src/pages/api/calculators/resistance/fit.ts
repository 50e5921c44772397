import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { resistanceFitSchema } from '~/lib/schemas/calc-fit';
import { fitResistance } from '~/lib/server/calc-fit';

/** Fits the hull's form factor to logged speed and electrical power; nothing saved. */
export const POST: APIRoute = handle(async ({ locals, request }) => {
  requirePermission(locals, 'read');
  const body = await readJson(request, resistanceFitSchema, 512 * 1024);
  return json(fitResistance(body));
});
