import { and, eq, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { passwordResets, users } from '../db/schema';
import { HttpError, invalidInput, notFound } from '../http';
import { recordAudit } from '../audit';
import { sendMail } from '../mail/send';
import { passwordChangedEmail } from '../mail/messages';
import { hashPassword, verifyPassword } from './password';
import { endOtherSessions } from './lucia';
import { signInByAccount } from './throttle';
import type { ChangePasswordInput } from './new-password';

/**
 * Changes a signed-in person's password once their current one is confirmed. Every other session of theirs ends
 * (the one used here stays), open reset links are spent, the change is audited and a confirmation e-mail goes out.
 * Wrong current passwords count against the same per-account limit as failed sign-ins, so a borrowed session
 * cannot be used to guess the password.
 */
export async function changePassword(
  actor: { id: string; email: string },
  sessionId: string,
  input: ChangePasswordInput,
  ip: string,
  base: string,
): Promise<void> {
  const retryAfter = signInByAccount.retryAfter(actor.email);
  if (retryAfter > 0)
    throw new HttpError(
      429,
      'rate_limited',
      `Too many wrong passwords for this account. Try again in ${Math.ceil(retryAfter / 60)} minutes.`,
      [],
      {},
      { 'retry-after': String(retryAfter) },
    );
  const release = signInByAccount.reserve(actor.email);
  const user = db().select().from(users).where(eq(users.id, actor.id)).get();
  if (!user) throw notFound('Your account');
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    recordAudit({ actor, action: 'account.password-change-failed', targetType: 'user', targetId: user.id, ip });
    throw invalidInput([{ path: 'currentPassword', message: 'That is not your current password.' }]);
  }
  release();
  const passwordHash = await hashPassword(input.newPassword);
  const now = new Date();
  let otherSessions = 0;
  db().transaction((tx) => {
    tx.update(users).set({ passwordHash }).where(eq(users.id, user.id)).run();
    // A reset link asked for before the change must not undo it.
    tx.update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, user.id), isNull(passwordResets.usedAt)))
      .run();
  });
  otherSessions = endOtherSessions(user.id, sessionId);
  recordAudit({
    actor,
    action: 'account.password-change',
    targetType: 'user',
    targetId: user.id,
    detail: { otherSessionsEnded: otherSessions },
    ip,
  });
  await sendMail(
    user.email,
    passwordChangedEmail({ name: user.name, at: now, otherSessions, resetUrl: `${base}/forgot-password` }),
  );
}
