import type { APIRoute } from 'astro';
import { eq } from 'drizzle-orm';
import { handle, invalidInput, json, notFound, readJson, requirePermission } from '~/lib/server/http';
import { findSubsystem } from '~/lib/server/seasons';
import { subsystemPatchSchema } from '~/lib/schemas/seasons';
import { db } from '~/lib/server/db/client';
import { subsystems } from '~/lib/server/db/schema';
import { recordAudit } from '~/lib/server/audit';

export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'subsystem:manage');
  const slug = params.slug ?? '';
  if (!findSubsystem(slug)) throw notFound('That subsystem');
  const patch = await readJson(request, subsystemPatchSchema, 8 * 1024);
  if (Object.keys(patch).length === 0)
    throw invalidInput([{ path: '', message: 'Send a new name or summary.' }], 'Nothing to change.');
  db().update(subsystems).set(patch).where(eq(subsystems.slug, slug)).run();
  recordAudit({ actor: user, action: 'subsystem.update', targetType: 'subsystem', targetId: slug });
  return json({ subsystem: findSubsystem(slug) });
});
