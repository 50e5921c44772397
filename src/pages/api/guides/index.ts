import type { APIRoute } from 'astro';
import { z } from 'zod';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { listGuides } from '~/lib/server/guides';
import { markCacheable } from '~/lib/server/response-cache';

const querySchema = z.object({
  subsystem: z
    .string()
    .max(64)
    .regex(/^[a-z0-9-]*$/)
    .optional(),
});

export const GET: APIRoute = handle(async ({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const { subsystem } = parseQuery(url, querySchema);
  const guides = await listGuides(subsystem || undefined);
  return json({
    guides: guides.map((g) => ({
      slug: g.slug,
      title: g.title,
      subsystem: g.subsystem,
      summary: g.summary,
      url: g.url,
      order: g.order,
      audience: g.audience,
      reviewedBy: g.reviewedBy,
      reviewedOn: g.reviewedOn,
      reviewStale: g.reviewStale,
      calculations: g.calculations,
    })),
  });
});
