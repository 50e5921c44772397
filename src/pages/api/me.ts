import type { APIRoute } from 'astro';
import { handle, json, readJson, requireUser } from '~/lib/server/http';
import { toPublicUser } from '~/lib/server/users';
import { mePatchSchema } from '~/lib/schemas/people';
import { setDigestOptIn } from '~/lib/server/account';

export const GET: APIRoute = handle(({ locals }) => json({ user: toPublicUser(requireUser(locals)) }));

/** A person's own preferences; for now whether they get the weekly digest. */
export const PATCH: APIRoute = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const input = await readJson(request, mePatchSchema, 4 * 1024);
  return json({ user: toPublicUser(user), digestOptIn: setDigestOptIn(user, input.digestOptIn) });
});
