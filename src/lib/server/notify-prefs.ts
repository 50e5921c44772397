// Which e-mails about questions a person wants: new questions that may concern them, answers to their own.
import { eq } from 'drizzle-orm';
import { db } from './db/client';
import { users } from './db/schema';
import { recordAudit } from './audit';

export interface NotifyPrefs {
  notifyQuestions: boolean;
  notifyAnswers: boolean;
}

export function notifyPrefsOf(userId: string): NotifyPrefs {
  return (
    db()
      .select({ notifyQuestions: users.notifyQuestions, notifyAnswers: users.notifyAnswers })
      .from(users)
      .where(eq(users.id, userId))
      .get() ?? { notifyQuestions: true, notifyAnswers: true }
  );
}

export function setNotifyPrefs(actor: { id: string; email: string }, change: Partial<NotifyPrefs>): NotifyPrefs {
  const set = Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined));
  if (Object.keys(set).length > 0) {
    db().update(users).set(set).where(eq(users.id, actor.id)).run();
    recordAudit({ actor, action: 'account.notify', targetType: 'user', targetId: actor.id, detail: set });
  }
  return notifyPrefsOf(actor.id);
}
