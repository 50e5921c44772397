import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { importBulkChangeSchema } from '~/lib/schemas/import-review';
import { changeImportedDrafts, getImportReview } from '~/lib/server/import-review';

/** The review list: every file of the import and the draft it became (importer or lead). */
export const GET: APIRoute = handle(({ locals, params }) => {
  const user = requirePermission(locals, 'record:import', { seasonIsCurrent: true });
  return json({ review: getImportReview(params.id ?? '', user) });
});

/** Changes the kind, subsystem or season of many drafts of the import at once → `{updated}`. */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:import', { seasonIsCurrent: true });
  const input = await readJson(request, importBulkChangeSchema);
  return json({ updated: changeImportedDrafts(params.id ?? '', input, user) });
});
