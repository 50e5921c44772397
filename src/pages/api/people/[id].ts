import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { personPatchSchema } from '~/lib/schemas/people';
import { updatePerson } from '~/lib/server/people-admin';

/** Leads change a person's role and their subsystems in the current season. */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const actor = requirePermission(locals, 'people:manage');
  const patch = await readJson(request, personPatchSchema, 16 * 1024);
  return json({ person: updatePerson(params.id ?? '', patch, actor) });
});
