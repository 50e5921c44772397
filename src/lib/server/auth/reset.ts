import { and, eq, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { passwordResets, users } from '../db/schema';
import { hashToken, newToken } from '../ids';
import { recordAudit } from '../audit';
import { hashPassword } from './password';
import { endAllSessions } from './lucia';
import { normaliseEmail } from './sign-in';
import { resetByAccount, resetByAddress, signInByAccount } from './throttle';
import { sendMail } from '../mail/send';
import { resetEmail } from '../mail/messages';
import { linkError, type SpentReason } from '../link-tokens';

export const RESET_MINUTES = 60;

export type ResetRequestResult = { ok: true } | { ok: false; retryAfter: number };

/**
 * Mails a one-hour, single-use link when the address has an account, and answers the same either way. The mail
 * is not awaited, so a slow SMTP server cannot reveal through timing which addresses have accounts.
 */
export function requestPasswordReset(rawEmail: string, ip: string, base: string): ResetRequestResult {
  const email = normaliseEmail(rawEmail);
  const retryAfter = Math.max(resetByAccount.retryAfter(email), resetByAddress.retryAfter(ip));
  if (retryAfter > 0) {
    recordAudit({ actor: null, action: 'auth.reset-throttled', targetType: 'user', targetId: email, ip });
    return { ok: false, retryAfter };
  }
  // Every request counts, found or not: the throttle guards the mailbox and the mail server, not only guesses.
  resetByAccount.fail(email);
  resetByAddress.fail(ip);
  const user = db().select().from(users).where(eq(users.email, email)).get();
  if (!user) {
    recordAudit({
      actor: null,
      action: 'auth.reset-request',
      targetType: 'user',
      targetId: email,
      detail: { account: false },
      ip,
    });
    return { ok: true };
  }
  const token = newToken();
  const now = new Date();
  const expiresAt = new Date(now.getTime() + RESET_MINUTES * 60_000);
  db()
    .insert(passwordResets)
    .values({ tokenHash: hashToken(token), userId: user.id, createdAt: now, expiresAt })
    .run();
  recordAudit({
    actor: null,
    action: 'auth.reset-request',
    targetType: 'user',
    targetId: user.id,
    detail: { account: true },
    ip,
  });
  void sendMail(user.email, resetEmail({ name: user.name, url: `${base}/reset/${token}`, expiresAt })).catch((e) => {
    console.error('[wakebook] could not record the reset e-mail:', e);
  });
  return { ok: true };
}

export type ResetTokenCheck =
  { state: 'valid'; userId: string; tokenHash: string } | { state: Exclude<SpentReason, 'revoked'> | 'unknown' };

export function checkResetToken(token: string): ResetTokenCheck {
  const tokenHash = hashToken(token);
  const row = db().select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).get();
  if (!row) return { state: 'unknown' };
  if (row.usedAt) return { state: 'used' };
  if (row.expiresAt.getTime() <= Date.now()) return { state: 'expired' };
  return { state: 'valid', userId: row.userId, tokenHash };
}

/** Sets the new password, spends this and every other open link of the account, and ends all its sessions. */
export async function resetPassword(token: string, password: string, ip: string): Promise<void> {
  const check = checkResetToken(token);
  if (check.state !== 'valid') throw linkError(check.state);
  const passwordHash = await hashPassword(password);
  const now = new Date();
  db().transaction((tx) => {
    const spent = tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.tokenHash, check.tokenHash), isNull(passwordResets.usedAt)))
      .run();
    if (spent.changes !== 1) throw linkError('used');
    tx.update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, check.userId), isNull(passwordResets.usedAt)))
      .run();
    tx.update(users).set({ passwordHash }).where(eq(users.id, check.userId)).run();
  });
  await endAllSessions(check.userId);
  const user = db().select({ id: users.id, email: users.email }).from(users).where(eq(users.id, check.userId)).get();
  // The owner proved control of the mailbox; earlier wrong guesses no longer lock them out.
  if (user) signInByAccount.clear(user.email);
  recordAudit({
    actor: user ?? null,
    action: 'auth.password-reset',
    targetType: 'user',
    targetId: check.userId,
    detail: { sessionsEnded: true },
    ip,
  });
}
