import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { listSubsystems } from '~/lib/server/seasons';
import { createSubsystem } from '~/lib/server/subsystems';
import { subsystemCreateSchema } from '~/lib/schemas/seasons';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  return json({ subsystems: listSubsystems() });
});

export const POST: APIRoute = handle(async ({ locals, request }) => {
  const user = requirePermission(locals, 'subsystem:manage');
  const input = await readJson(request, subsystemCreateSchema, 8 * 1024);
  return json({ subsystem: createSubsystem(input, user) }, 201);
});
