import type { APIRoute } from 'astro';
import { handle, json, readJson, requireUser } from '~/lib/server/http';
import { recordStatusChangeSchema } from '~/lib/schemas/records';
import { changeStatus, requireSomeStatusRight } from '~/lib/server/records/write';

/** Moves a record along its lifecycle; who may make which move is decided per move in changeStatus. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requireUser(locals);
  requireSomeStatusRight(user);
  const input = await readJson(request, recordStatusChangeSchema, 8 * 1024);
  return json({ record: changeStatus(params.id ?? '', input, user) });
});
