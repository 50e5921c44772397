import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { importDiscardSchema } from '~/lib/schemas/import-review';
import { discardImportedDrafts } from '~/lib/server/import-review';

/** Discards many drafts of the import at once (importer or lead) → `{discarded}`. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:import', { seasonIsCurrent: true });
  const input = await readJson(request, importDiscardSchema);
  return json({ discarded: discardImportedDrafts(params.id ?? '', input, user) });
});
