import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { listSeasons } from '~/lib/server/seasons';
import { createSeason } from '~/lib/server/season-admin';
import { seasonCreateSchema } from '~/lib/schemas/seasons';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  return json({ seasons: listSeasons() });
});

/** Opens a season (lead). A duplicate name is 409; an end before the start is 400. */
export const POST: APIRoute = handle(async ({ locals, request }) => {
  const user = requirePermission(locals, 'season:manage');
  const input = await readJson(request, seasonCreateSchema, 8 * 1024);
  return json({ season: createSeason(input, user) }, 201);
});
