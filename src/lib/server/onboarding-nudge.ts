import { eq } from 'drizzle-orm';
import { recordAudit } from './audit';
import { db } from './db/client';
import { users } from './db/schema';
import { notFound } from './http';
import { sendMail } from './mail/send';
import { onboardingNudgeEmail } from './mail/messages';
import { subsystemsOf } from './memberships';
import { getRoute } from './onboarding';
import { publicBase } from './public-url';
import { currentSeason } from './seasons';

type Actor = { id: string; email: string; name: string };

/**
 * A lead reminds someone to carry on with their onboarding: one e-mail through the mail module naming where they
 * are on the routes of the subsystems they own this season, and an audit entry. The mail's outcome is returned
 * (a failed send is stored and shown, never thrown).
 */
export async function nudgeOnboarding(userId: string, note: string | undefined, actor: Actor, requestUrl: URL) {
  const person = db()
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(eq(users.id, userId))
    .get();
  if (!person) throw notFound('That person');
  const season = currentSeason();
  const base = publicBase(requestUrl);
  const routes = [];
  for (const s of season ? subsystemsOf(person.id, season.id) : []) {
    const r = await getRoute(s.slug, person.id);
    if (r.progress.total > 0) routes.push({ name: s.name, ...r.progress, url: `${base}/subsystems/${s.slug}#route-h` });
  }
  const mail = await sendMail(
    person.email,
    onboardingNudgeEmail({ name: person.name, leadName: actor.name, routes, note }),
  );
  recordAudit({
    actor,
    action: 'onboarding.nudge',
    targetType: 'user',
    targetId: person.id,
    detail: { mail: mail.status },
  });
  return { mail: { status: mail.status } };
}
