import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { recordStatusChangeSchema } from '~/lib/schemas/records';
import { changeStatus } from '~/lib/server/records/write';

export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:create');
  const input = await readJson(request, recordStatusChangeSchema, 8 * 1024);
  return json({ record: changeStatus(params.id ?? '', input, user) });
});
