// The real SMTP path: a local smtp-server on 127.0.0.1 (random port) receives what Wakebook sends.
import { describe, it, expect, beforeAll, afterAll, vi } from 'vitest';
import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { call } from '../setup/http';
import { seedDemo, sessionFor, demoAccounts } from '../setup/db';
import { resetSettingsForTests } from '../../src/lib/server/config';
import * as invitations from '../../src/pages/api/invitations/index';
import * as resend from '../../src/pages/api/invitations/[id]/resend';
import * as accept from '../../src/pages/api/auth/accept-invitation';
import * as requestReset from '../../src/pages/api/auth/request-reset';
import * as outbox from '../../src/pages/api/outbox';
import { db } from '../../src/lib/server/db/client';
import { mailMessages } from '../../src/lib/server/db/schema';
import { eq } from 'drizzle-orm';

interface Received {
  from: string;
  to: string[];
  raw: string;
}

const received: Received[] = [];
let server: SMTPServer;
let port = 0;
let lead = '';

function startServer(): Promise<number> {
  server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        received.push({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks).toString('utf8'),
        });
        done();
      });
    },
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () => resolve((server.server.address() as AddressInfo).port)),
  );
}

function useSmtp(url: string) {
  process.env.SMTP_URL = url;
  process.env.MAIL_FROM = 'Northmere Wakebook <wakebook@northmere.example>';
  resetSettingsForTests();
}

/** Undoes quoted-printable soft breaks and escapes, enough to read links and words in the body. */
function decodeQp(raw: string): string {
  return raw.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
}

async function waitFor<T>(fn: () => T | undefined, ms = 5000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = fn();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 25));
  }
}

beforeAll(async () => {
  await seedDemo();
  lead = await sessionFor('lead');
  port = await startServer();
  useSmtp(`smtp://127.0.0.1:${port}`);
});

afterAll(async () => {
  delete process.env.SMTP_URL;
  delete process.env.MAIL_FROM;
  resetSettingsForTests();
  await new Promise<void>((r) => server.close(() => r()));
});

describe('mail over SMTP', () => {
  it('delivers the invitation with a text and an HTML part, and records it as sent', async () => {
    const res = await call(invitations, 'POST', {
      body: { email: 'smtp.person@northmere.example', name: 'Smtp Person', role: 'member' },
      session: lead,
    });
    expect(res.status).toBe(201);
    expect(res.body.mail.status).toBe('sent');
    const msg = received.find((m) => m.to.includes('smtp.person@northmere.example'))!;
    expect(msg.from).toBe('wakebook@northmere.example');
    expect(msg.raw).toMatch(/^Subject: Maren Kowalczyk invited you to Wakebook/m);
    expect(msg.raw).toMatch(/Content-Type: multipart\/alternative/);
    expect(msg.raw).toMatch(/Content-Type: text\/plain/);
    expect(msg.raw).toMatch(/Content-Type: text\/html/);
    const body = decodeQp(msg.raw);
    const link = /http:\/\/localhost:4321\/invite\/([A-Za-z0-9_-]{20,})/.exec(body);
    expect(link).not.toBeNull();
    const stored = db().select().from(mailMessages).where(eq(mailMessages.to, 'smtp.person@northmere.example')).all();
    expect(stored.map((m) => [m.transport, m.status])).toEqual([['smtp', 'sent']]);
    // The link from the real e-mail works.
    const ok = await call(accept, 'POST', { body: { token: link![1], password: 'smtp-delivered-link-7' } });
    expect(ok.status).toBe(201);
  });

  it('has no outbox while mail goes to a server (404)', async () => {
    expect((await call(outbox, 'GET', { session: lead })).status).toBe(404);
  });

  it('keeps the invitation when the server cannot be reached, logs one clear line, and sends on resend', async () => {
    const closed = await startClosedPort();
    useSmtp(`smtp://127.0.0.1:${closed}`);
    const errors = vi.spyOn(console, 'error').mockImplementation(() => {});
    const res = await call(invitations, 'POST', {
      body: { email: 'down.time@northmere.example', name: 'Down Time', role: 'advisor' },
      session: lead,
    });
    expect(res.status).toBe(201);
    expect(res.body.mail.status).toBe('failed');
    expect(res.body.invitation.status).toBe('pending');
    expect(errors).toHaveBeenCalledTimes(1);
    expect(String(errors.mock.calls[0][0])).toMatch(
      /mail .* to down\.time@northmere\.example was not sent over SMTP: .*kept in mail_messages as failed/i,
    );
    errors.mockRestore();
    const failed = db().select().from(mailMessages).where(eq(mailMessages.to, 'down.time@northmere.example')).get()!;
    expect(failed).toMatchObject({ transport: 'smtp', status: 'failed' });
    expect(failed.error).toBeTruthy();
    const list = await call(invitations, 'GET', { session: lead });
    const row = list.body.invitations.find((i: { email: string }) => i.email === 'down.time@northmere.example');
    expect(row.mail.status).toBe('failed');

    useSmtp(`smtp://127.0.0.1:${port}`);
    const again = await call(resend, 'POST', { params: { id: res.body.invitation.id }, session: lead });
    expect(again.status).toBe(200);
    expect(again.body.mail.status).toBe('sent');
    expect(received.some((m) => m.to.includes('down.time@northmere.example'))).toBe(true);
  });

  it('sends the reset link over SMTP without making the request wait for it', async () => {
    const res = await call(requestReset, 'POST', { body: { email: demoAccounts.member }, ip: '127.0.11.1' });
    expect(res.status).toBe(202);
    const msg = await waitFor(() => received.find((m) => m.to.includes(demoAccounts.member)));
    expect(decodeQp(msg.raw)).toMatch(/http:\/\/localhost:4321\/reset\/[A-Za-z0-9_-]{20,}/);
  });
});

/** A port nothing listens on: bind one, note it, close it. */
async function startClosedPort(): Promise<number> {
  const net = await import('node:net');
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', () => r()));
  const p = (s.address() as AddressInfo).port;
  await new Promise<void>((r) => s.close(() => r()));
  return p;
}
