import { eq } from 'drizzle-orm';
import { db } from '../db/client';
import { users } from '../db/schema';
import { recordAudit } from '../audit';
import { sendMail } from '../mail/send';
import { digestEmail } from '../mail/messages';
import { buildDigest } from './build';

export const DIGEST_DAYS = 7;

export interface DigestRun {
  since: string;
  recipients: number;
  sent: number;
  failed: number;
  /** Opted in, but nothing happened that concerns them: no empty e-mail is sent. */
  skipped: number;
}

/** Sends the digest to everyone who opted in; `actor` is the lead who pressed the button, or null for the scheduler. */
export async function sendDigests(p: {
  days?: number;
  base: string;
  actor: { id: string; email: string } | null;
  now?: Date;
}): Promise<DigestRun> {
  const since = new Date((p.now ?? new Date()).getTime() - (p.days ?? DIGEST_DAYS) * 24 * 3600 * 1000);
  const people = db()
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.digestOptIn, true))
    .all();
  const run: DigestRun = { since: since.toISOString(), recipients: people.length, sent: 0, failed: 0, skipped: 0 };
  for (const person of people) {
    const digest = await buildDigest(person.id, since, p.base);
    if (digest.sections.length === 0) {
      run.skipped++;
      continue;
    }
    const result = await sendMail(
      person.email,
      digestEmail({ name: person.name, since, sections: digest.sections, accountUrl: `${p.base}/account` }),
    );
    if (result.status === 'failed') run.failed++;
    else run.sent++;
  }
  recordAudit({
    actor: p.actor,
    action: 'digest.send',
    targetType: 'digest',
    detail: { ...run, by: p.actor ? 'lead' : 'scheduler' },
  });
  return run;
}
