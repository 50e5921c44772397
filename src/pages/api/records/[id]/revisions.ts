import type { APIRoute } from 'astro';
import { handle, json, notFound, requirePermission } from '~/lib/server/http';
import { getRecordView, listRevisions } from '~/lib/server/records/view';

export const GET: APIRoute = handle(({ locals, params }) => {
  requirePermission(locals, 'read');
  const id = params.id ?? '';
  if (!getRecordView(id)) throw notFound('That record');
  return json({ revisions: listRevisions(id) });
});
