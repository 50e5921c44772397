import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { requireSubsystem, updateSubsystem } from '~/lib/server/subsystems';
import { subsystemPatchSchema } from '~/lib/schemas/seasons';

/** Renames a subsystem or edits its summary (lead). */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'subsystem:manage');
  const current = requireSubsystem(params.slug ?? '');
  const patch = await readJson(request, subsystemPatchSchema, 8 * 1024);
  return json({ subsystem: updateSubsystem(current, patch, user) });
});
