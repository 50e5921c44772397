import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { updateSeason } from '~/lib/server/season-admin';
import { seasonPatchSchema } from '~/lib/schemas/seasons';

/** Moves a season's phase, edits its dates or name, or makes it the current one (lead). */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'season:manage');
  const patch = await readJson(request, seasonPatchSchema, 8 * 1024);
  return json({ season: updateSeason(params.id ?? '', patch, user) });
});
