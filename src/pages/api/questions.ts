import type { APIRoute } from 'astro';
import { handle, json, parseQuery, requirePermission } from '~/lib/server/http';
import { questionsQuerySchema } from '~/lib/schemas/records';
import { listQuestions } from '~/lib/server/questions';
import { markCacheable } from '~/lib/server/response-cache';

export const GET: APIRoute = handle(({ locals, url }) => {
  markCacheable(locals);
  requirePermission(locals, 'read');
  const q = parseQuery(url, questionsQuerySchema);
  return json({ questions: listQuestions({ state: q.state || undefined, subsystem: q.subsystem || undefined }) });
});
