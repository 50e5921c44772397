import type { APIRoute } from 'astro';
import { handle, json, requirePermission, notFound } from '~/lib/server/http';
import { listOutbox } from '~/lib/server/mail/outbox';
import { mailMode } from '~/lib/server/mail/transport';

/** Captured mail for leads; with a real SMTP server configured there is no outbox (404). */
export const GET: APIRoute = handle(({ locals }) => {
  requirePermission(locals, 'outbox:read');
  if (mailMode() !== 'capture') throw notFound('The outbox (mail goes to the SMTP server)');
  return json({
    messages: listOutbox().map(({ to, subject, text, html, sentAt }) => ({ to, subject, text, html, sentAt })),
  });
});
