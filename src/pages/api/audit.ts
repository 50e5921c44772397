import type { APIRoute } from 'astro';
import { z } from 'zod';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { listAudit } from '~/lib/server/audit-log';

const querySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  cursor: z.coerce.number().int().positive().optional(),
  action: z.string().max(64).optional(),
  actor: z.string().max(254).optional(),
});

export const GET: APIRoute = handle(async ({ locals, url }) => {
  requirePermission(locals, 'audit:read');
  const q = parseQuery(url, querySchema);
  return json(await listAudit({ limit: q.limit, before: q.cursor, action: q.action, actor: q.actor }));
});
