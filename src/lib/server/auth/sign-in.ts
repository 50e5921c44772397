import { eq } from 'drizzle-orm';
import type { AstroCookies } from 'astro';
import { db } from '../db/client';
import { users } from '../db/schema';
import { verifyPassword, verifyDecoy } from './password';
import { startSession } from './lucia';
import { signInByAccount, signInByAddress } from './throttle';
import { recordAudit } from '../audit';
import type { PublicUser } from '../users';
import { toPublicUser } from '../users';

export type SignInResult =
  | { ok: true; user: PublicUser }
  | { ok: false; reason: 'invalid' }
  | { ok: false; reason: 'throttled'; retryAfter: number };

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** Checks the password, throttles repeated failures per account and per address, and starts a session. */
export async function attemptSignIn(
  input: { email: string; password: string },
  ip: string,
  cookies: AstroCookies,
): Promise<SignInResult> {
  const email = normaliseEmail(input.email);
  const retryAfter = Math.max(signInByAccount.retryAfter(email), signInByAddress.retryAfter(ip));
  if (retryAfter > 0) {
    recordAudit({ actor: null, action: 'auth.sign-in-throttled', targetType: 'user', targetId: email, ip });
    return { ok: false, reason: 'throttled', retryAfter };
  }
  // Counted before the (slow) password check is awaited; a right password takes the attempts back below.
  signInByAccount.reserve(email);
  const releaseAddress = signInByAddress.reserve(ip);
  const user = db().select().from(users).where(eq(users.email, email)).get();
  const valid = user ? await verifyPassword(user.passwordHash, input.password) : await verifyDecoy(input.password);
  if (!user || !valid) {
    recordAudit({ actor: null, action: 'auth.sign-in-failed', targetType: 'user', targetId: email, ip });
    return { ok: false, reason: 'invalid' };
  }
  signInByAccount.clear(email);
  releaseAddress();
  await startSession(user.id, cookies);
  const now = new Date();
  db().update(users).set({ lastSignInAt: now }).where(eq(users.id, user.id)).run();
  recordAudit({
    actor: { id: user.id, email: user.email },
    action: 'auth.sign-in',
    targetType: 'user',
    targetId: user.id,
    ip,
  });
  return { ok: true, user: toPublicUser(user) };
}
