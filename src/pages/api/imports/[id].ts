import type { APIRoute } from 'astro';
import { handle, json, requireUser } from '~/lib/server/http';
import { getImport } from '~/lib/server/imports';

export const GET: APIRoute = handle(({ locals, params }) => {
  const user = requireUser(locals);
  return json({ import: getImport(params.id ?? '', user) });
});
