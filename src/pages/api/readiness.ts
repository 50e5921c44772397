import type { APIRoute } from 'astro';
import { z } from 'zod';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { readinessFor } from '~/lib/server/readiness';
import { markCacheable } from '~/lib/server/response-cache';

const querySchema = z.object({
  season: z
    .string()
    .max(64)
    .regex(/^[A-Za-z0-9_-]*$/)
    .optional(),
});

export const GET: APIRoute = handle(async ({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const { season } = parseQuery(url, querySchema);
  const r = await readinessFor(season || undefined);
  return json({
    season: r.season,
    subsystems: r.subsystems.map((s) => ({
      slug: s.slug,
      name: s.name,
      score: s.score,
      has: s.has,
      missing: s.missing,
      checks: s.checks,
    })),
  });
});
