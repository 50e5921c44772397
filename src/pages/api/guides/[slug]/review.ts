import type { APIRoute } from 'astro';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { guideReviewInputSchema } from '~/lib/schemas/guides';
import { reviewGuide } from '~/lib/server/guides';

/** An advisor or lead marks the guide reviewed from the app; the guide then shows the later of this and its file's review. */
export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'guide:review');
  const { note } = await readJson(request, guideReviewInputSchema, 8 * 1024);
  return json({ guide: await reviewGuide(params.slug ?? '', note, user) }, 201);
});
