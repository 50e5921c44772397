import type { APIRoute } from 'astro';
import { handle, json, requireUser } from '~/lib/server/http';
import { markAnswered } from '~/lib/server/questions';

/** Marks a question answered (the asker, the record's author, an advisor or a lead; the rule is in policy.ts). */
export const POST: APIRoute = handle(({ locals, params }) => {
  const user = requireUser(locals);
  return json({ comment: markAnswered(params.id ?? '', user) });
});
