import type { APIRoute } from 'astro';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { searchQuerySchema } from '~/lib/schemas/search';
import { searchEverything } from '~/lib/server/search';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(async ({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  return json(await searchEverything(parseQuery(url, searchQuerySchema)));
});
