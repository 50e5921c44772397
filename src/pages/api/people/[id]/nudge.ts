import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { nudgeSchema } from '~/lib/schemas/people';
import { nudgeOnboarding } from '~/lib/server/onboarding-nudge';

/** A lead e-mails someone a reminder to carry on with their onboarding route. */
export const POST: APIRoute = handle(async ({ locals, params, request, url }) => {
  const actor = requirePermission(locals, 'onboarding:nudge');
  const { note } = await readJson(request, nudgeSchema, 8 * 1024);
  return json(await nudgeOnboarding(params.id ?? '', note, actor, url), 201);
});
