import type { APIRoute } from 'astro';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { offlinePackQuerySchema } from '~/lib/schemas/offline';
import { offlinePack } from '~/lib/server/offline-pack';

/** What the signed-in person's browser keeps for reading offline (lib/server/offline-pack.ts). */
export const GET: APIRoute = handle(async ({ locals, url }) => {
  const user = requirePermission(locals, 'read');
  const { since } = parseQuery(url, offlinePackQuerySchema);
  return json(await offlinePack({ id: user.id, role: user.role }, since), 200, { 'cache-control': 'no-store' });
});
