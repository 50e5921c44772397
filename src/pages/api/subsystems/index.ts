import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { listSubsystems } from '~/lib/server/seasons';

export const GET: APIRoute = handle(({ locals }) => {
  requirePermission(locals, 'read');
  return json({ subsystems: listSubsystems() });
});
