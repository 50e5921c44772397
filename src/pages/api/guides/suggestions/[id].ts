import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { suggestionStateInputSchema } from '~/lib/schemas/guides';
import { decideSuggestion } from '~/lib/server/guide-suggestions';

/** An advisor or lead marks a suggestion done or declined (or open again). */
export const PATCH: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'guide:triage');
  const { state } = await readJson(request, suggestionStateInputSchema, 4 * 1024);
  return json({ suggestion: decideSuggestion(params.id ?? '', state, user) });
});
