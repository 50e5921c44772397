import { db } from '../db/client';
import { mailMessages } from '../db/schema';
import { newId } from '../ids';
import { mailMode, senderAddress, smtpTransport } from './transport';
import type { RenderedEmail } from './layout';

export interface MailResult {
  id: string;
  status: 'captured' | 'sent' | 'failed';
  error: string | null;
}

/**
 * Sends one message and keeps a copy in mail_messages, so leads can read captured mail and failures are never
 * silent. A failure is logged and stored, never thrown: whatever the mail was about (an invitation, a reset) is
 * already saved by the caller and can be sent again.
 */
export async function sendMail(to: string, mail: RenderedEmail): Promise<MailResult> {
  const id = newId();
  const base = { id, to, subject: mail.subject, text: mail.text, html: mail.html };
  if (mailMode() === 'capture') {
    db()
      .insert(mailMessages)
      .values({ ...base, transport: 'capture', status: 'captured', sentAt: new Date() })
      .run();
    return { id, status: 'captured', error: null };
  }
  try {
    await smtpTransport().sendMail({
      from: senderAddress(),
      to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
    });
    db()
      .insert(mailMessages)
      .values({ ...base, transport: 'smtp', status: 'sent', sentAt: new Date() })
      .run();
    return { id, status: 'sent', error: null };
  } catch (e) {
    const error = e instanceof Error ? e.message.slice(0, 500) : String(e);
    console.error(
      `[wakebook] mail "${mail.subject}" to ${to} was not sent over SMTP: ${error}. Kept in mail_messages as failed (id ${id}); it can be sent again.`,
    );
    db()
      .insert(mailMessages)
      .values({ ...base, transport: 'smtp', status: 'failed', error, sentAt: new Date() })
      .run();
    return { id, status: 'failed', error };
  }
}
