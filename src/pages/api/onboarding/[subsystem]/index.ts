import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { getRoute, replaceRoute } from '~/lib/server/onboarding';
import { onboardingRouteSchema } from '~/lib/schemas/onboarding';

export const GET: APIRoute = handle(async ({ locals, params }) => {
  const user = requirePermission(locals, 'read');
  return json(await getRoute(params.subsystem ?? '', user.id));
});

/** Replaces the route (advisors and leads); every item must exist. */
export const PUT: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'onboarding:curate');
  const { items } = await readJson(request, onboardingRouteSchema, 32 * 1024);
  return json(await replaceRoute(params.subsystem ?? '', items, user));
});
