import { eq } from 'drizzle-orm';
import { db } from './db/client';
import { users } from './db/schema';
import { recordAudit } from './audit';

export function digestOptInOf(userId: string): boolean {
  return db().select({ v: users.digestOptIn }).from(users).where(eq(users.id, userId)).get()?.v ?? false;
}

export function setDigestOptIn(actor: { id: string; email: string }, optIn: boolean): boolean {
  db().update(users).set({ digestOptIn: optIn }).where(eq(users.id, actor.id)).run();
  recordAudit({
    actor,
    action: 'account.digest',
    targetType: 'user',
    targetId: actor.id,
    detail: { digestOptIn: optIn },
  });
  return optIn;
}

export function countDigestSubscribers(): number {
  return db().select({ id: users.id }).from(users).where(eq(users.digestOptIn, true)).all().length;
}
