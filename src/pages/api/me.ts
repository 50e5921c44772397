import type { APIRoute } from 'astro';
import { handle, json, readJson, requireUser } from '~/lib/server/http';
import { toPublicUser } from '~/lib/server/users';
import { mePatchSchema } from '~/lib/schemas/people';
import { digestOptInOf, setDigestOptIn } from '~/lib/server/account';
import { setNotifyPrefs } from '~/lib/server/notify-prefs';

export const GET: APIRoute = handle(({ locals }) => json({ user: toPublicUser(requireUser(locals)) }));

/** A person's own e-mail choices: the weekly digest, new questions for them, answers to their questions. */
export const PATCH: APIRoute = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const input = await readJson(request, mePatchSchema, 4 * 1024);
  const digestOptIn =
    input.digestOptIn === undefined ? digestOptInOf(user.id) : setDigestOptIn(user, input.digestOptIn);
  const prefs = setNotifyPrefs(user, { notifyQuestions: input.notifyQuestions, notifyAnswers: input.notifyAnswers });
  return json({ user: toPublicUser(user), digestOptIn, ...prefs });
});
