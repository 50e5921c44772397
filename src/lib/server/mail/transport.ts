import nodemailer from 'nodemailer';
import { settings } from '../config';

/** Where mail goes: a real SMTP server when SMTP_URL is set, otherwise the local capture (the outbox). */
export function mailMode(): 'smtp' | 'capture' {
  return settings().SMTP_URL ? 'smtp' : 'capture';
}

// Short limits so a dead or slow server fails a request in seconds, not the library's minutes.
export const SMTP_TIMEOUTS = {
  connectionTimeout: 10_000,
  greetingTimeout: 10_000,
  socketTimeout: 20_000,
  dnsTimeout: 5_000,
} as const;

let cached: { url: string; transporter: ReturnType<typeof nodemailer.createTransport> } | undefined;

/** One pooled-free SMTP transport per SMTP_URL (tests change the URL between files). */
export function smtpTransport() {
  const url = settings().SMTP_URL;
  if (!url) throw new Error('SMTP_URL is not set');
  if (cached?.url !== url) {
    cached?.transporter.close();
    cached = { url, transporter: nodemailer.createTransport({ url, ...SMTP_TIMEOUTS }) };
  }
  return cached.transporter;
}

export function senderAddress(): string {
  const s = settings();
  if (s.MAIL_FROM) return s.MAIL_FROM;
  const host = s.PUBLIC_URL ? new URL(s.PUBLIC_URL).hostname : 'localhost';
  return `Wakebook <wakebook@${host}>`;
}
