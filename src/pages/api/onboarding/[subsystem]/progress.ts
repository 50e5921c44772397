import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { getRoute, setProgress } from '~/lib/server/onboarding';
import { onboardingProgressSchema } from '~/lib/schemas/onboarding';

export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'onboarding:follow');
  const { itemId, done } = await readJson(request, onboardingProgressSchema, 4 * 1024);
  const slug = params.subsystem ?? '';
  await getRoute(slug, null); // 404 for an unknown subsystem
  setProgress(slug, user.id, itemId, done);
  return json((await getRoute(slug, user.id)).progress);
});
