import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission, conflict } from '~/lib/server/http';
import { findSubsystem, listSubsystems } from '~/lib/server/seasons';
import { subsystemCreateSchema } from '~/lib/schemas/seasons';
import { db } from '~/lib/server/db/client';
import { subsystems } from '~/lib/server/db/schema';
import { recordAudit } from '~/lib/server/audit';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  return json({ subsystems: listSubsystems() });
});

export const POST: APIRoute = handle(async ({ locals, request }) => {
  const user = requirePermission(locals, 'subsystem:manage');
  const input = await readJson(request, subsystemCreateSchema, 8 * 1024);
  if (findSubsystem(input.slug)) throw conflict(`A subsystem “${input.slug}” already exists.`);
  db()
    .insert(subsystems)
    .values({ ...input, position: listSubsystems().length, createdAt: new Date() })
    .run();
  recordAudit({ actor: user, action: 'subsystem.create', targetType: 'subsystem', targetId: input.slug });
  return json({ subsystem: findSubsystem(input.slug) }, 201);
});
