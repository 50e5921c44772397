import type { APIRoute } from 'astro';
import { handle, json, notFound, readJson, requirePermission } from '~/lib/server/http';
import { commentInputSchema } from '~/lib/schemas/records';
import { getComment, listComments, recordExists } from '~/lib/server/records/view';
import { addComment } from '~/lib/server/records/write';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const id = params.id ?? '';
  if (!recordExists(id)) throw notFound('That record');
  return json({ comments: listComments(id) });
});

export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:comment');
  const input = await readJson(request, commentInputSchema, 16 * 1024);
  const id = addComment(params.id ?? '', input, user);
  return json({ comment: getComment(id) }, 201);
});
