import type { APIRoute } from 'astro';
import { handle, json, notFound, readJson, requirePermission, requireUser } from '~/lib/server/http';
import { recordPatchSchema } from '~/lib/schemas/records';
import { getRecordView } from '~/lib/server/records/view';
import { discardDraft, updateRecord } from '~/lib/server/records/write';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const record = getRecordView(params.id ?? '');
  if (!record) throw notFound('That record');
  return json({ record });
});

/** Saves an edit of `version`; 409 with the current record when someone saved in between. */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:create');
  const patch = await readJson(request, recordPatchSchema, 512 * 1024);
  return json({ record: updateRecord(params.id ?? '', patch, user) });
});

/** Discards a draft: its author or a lead (204); 409 once it is past draft; 403 for anyone else. */
export const DELETE: APIRoute = handle(({ locals, params }) => {
  discardDraft(params.id ?? '', requireUser(locals));
  return json(null, 204);
});
