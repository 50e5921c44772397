import type { APIRoute } from 'astro';
import { handle, json, parseQuery, readJson, requirePermission } from '~/lib/server/http';
import { recordCreateSchema, recordListQuerySchema } from '~/lib/schemas/records';
import { listRecords } from '~/lib/server/records/list';
import { createRecord } from '~/lib/server/records/write';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const q = parseQuery(url, recordListQuerySchema);
  return json(
    listRecords({
      kind: q.kind || undefined,
      subsystem: q.subsystem || undefined,
      season: q.season || undefined,
      status: q.status || undefined,
      limit: q.limit,
      cursor: q.cursor,
    }),
  );
});

export const POST: APIRoute = handle(async ({ locals, request }) => {
  const user = requirePermission(locals, 'record:create');
  const input = await readJson(request, recordCreateSchema, 512 * 1024);
  return json({ record: createRecord(input, user) }, 201);
});
