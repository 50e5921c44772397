import type { APIRoute } from 'astro';
import { handle, json, notFound, requirePermission } from '~/lib/server/http';
import { getRecordView, listRevisions } from '~/lib/server/records/view';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const id = params.id ?? '';
  if (!getRecordView(id)) throw notFound('That record');
  return json({ revisions: listRevisions(id) });
});
