import { desc, eq, inArray, sql } from 'drizzle-orm';
import { db } from '../db/client';
import { mailMessages } from '../db/schema';

export interface OutboxMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  status: 'captured' | 'sent' | 'failed';
  sentAt: string;
}

/** Captured mail, newest first. */
export function listOutbox(limit = 100): OutboxMessage[] {
  return db()
    .select()
    .from(mailMessages)
    .where(eq(mailMessages.transport, 'capture'))
    .orderBy(desc(mailMessages.sentAt), desc(sql`rowid`)) // rowid: insertion order within one millisecond
    .limit(limit)
    .all()
    .map((m) => ({
      id: m.id,
      to: m.to,
      subject: m.subject,
      text: m.text,
      html: m.html,
      status: m.status,
      sentAt: m.sentAt.toISOString(),
    }));
}

/** The latest message to each address (for showing whether an invitation's e-mail went out). */
export function latestMailTo(
  addresses: string[],
): Map<string, { status: string; error: string | null; sentAt: string }> {
  const out = new Map<string, { status: string; error: string | null; sentAt: string }>();
  if (addresses.length === 0) return out;
  const rows = db()
    .select({
      to: mailMessages.to,
      status: mailMessages.status,
      error: mailMessages.error,
      sentAt: mailMessages.sentAt,
    })
    .from(mailMessages)
    .where(inArray(mailMessages.to, addresses))
    .orderBy(desc(mailMessages.sentAt), desc(sql`rowid`))
    .all();
  for (const r of rows)
    if (!out.has(r.to)) out.set(r.to, { status: r.status, error: r.error, sentAt: r.sentAt.toISOString() });
  return out;
}
