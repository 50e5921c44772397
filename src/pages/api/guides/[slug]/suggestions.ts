import type { APIRoute } from 'astro';
import { handle, json, parseQuery, readJson, requirePermission } from '~/lib/server/http';
import { guideSuggestionInputSchema, suggestionListQuerySchema } from '~/lib/schemas/guides';
import { listGuideSuggestions, suggestGuideChange } from '~/lib/server/guide-suggestions';

/** Advisors and leads read a guide's suggestions, optionally in one state (open, done, declined). */
export const GET: APIRoute = handle(async ({ locals, params, url }) => {
  requirePermission(locals, 'guide:triage');
  const { state } = parseQuery(url, suggestionListQuerySchema);
  return json({ suggestions: await listGuideSuggestions(params.slug ?? '', state) });
});

/** Anyone signed in suggests a change to a guide, for one of its sections or the whole. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'guide:suggest');
  const input = await readJson(request, guideSuggestionInputSchema, 16 * 1024);
  return json({ suggestion: await suggestGuideChange(params.slug ?? '', input, user) }, 201);
});
