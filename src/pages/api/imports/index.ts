import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { listImports, startImport } from '~/lib/server/imports';

export const GET: APIRoute = handle(({ locals }) => {
  const user = requirePermission(locals, 'record:import', { seasonIsCurrent: true });
  return json({ imports: listImports(user) });
});

export const POST: APIRoute = handle(async ({ locals, request }) => {
  const user = requirePermission(locals, 'record:import', { seasonIsCurrent: true });
  return json({ import: await startImport(request, user) }, 202);
});
