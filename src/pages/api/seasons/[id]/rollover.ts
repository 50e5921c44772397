import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { rollover } from '~/lib/server/season-admin';
import { rolloverSchema } from '~/lib/schemas/seasons';

/** Without `confirm: true` this only reports what would change. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'season:manage');
  const { continuing, confirm } = await readJson(request, rolloverSchema, 64 * 1024);
  return json(rollover(params.id ?? '', continuing, confirm, user));
});
