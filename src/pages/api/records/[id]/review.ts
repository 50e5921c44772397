import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { reviewInputSchema } from '~/lib/schemas/records';
import { reviewRecord } from '~/lib/server/records/write';

/** Marks the record's current version reviewed by the caller (advisors and leads). */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:review');
  const { note } = await readJson(request, reviewInputSchema, 8 * 1024);
  return json({ record: reviewRecord(params.id ?? '', note, user) });
});
