import type { APIRoute } from 'astro';
import { handle, json, notFound, readJson, requirePermission } from '~/lib/server/http';
import { commentInputSchema } from '~/lib/schemas/records';
import { recordExists } from '~/lib/server/records/view';
import { addComment, listComments } from '~/lib/server/questions';
import { publicBase } from '~/lib/server/public-url';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, params }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const id = params.id ?? '';
  if (!recordExists(id)) throw notFound('That record');
  return json({ comments: listComments(id) });
});

/** A question, a note, or (with replyTo) an answer; a question e-mails the people who may know. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:comment');
  const input = await readJson(request, commentInputSchema, 16 * 1024);
  const comment = await addComment(params.id ?? '', input, user, publicBase(request.url));
  return json({ comment }, 201);
});
