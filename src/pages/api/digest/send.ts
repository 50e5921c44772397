import type { APIRoute } from 'astro';
import { z } from 'zod';
import { handle, json, readJson, requirePermission } from '~/lib/server/http';
import { sendDigests, DIGEST_DAYS } from '~/lib/server/digest/send';
import { isCronRequest } from '~/lib/server/cron-auth';
import { publicBase } from '~/lib/server/public-url';

const bodySchema = z.object({ days: z.number().int().min(1).max(31).default(DIGEST_DAYS) });

/** Sends the digest now: a lead's "send now" button, or a scheduler with the cron token (`npm run digest`). */
export const POST: APIRoute = handle(async ({ locals, request, url }) => {
  const actor = isCronRequest(request) ? null : requirePermission(locals, 'digest:send');
  const input = await readJson(request, bodySchema, 4 * 1024);
  return json(await sendDigests({ days: input.days, base: publicBase(url), actor }));
});
