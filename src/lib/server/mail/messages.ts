// The words of each e-mail Wakebook sends. Links end with the token as their last path segment (API.md).
import { renderEmail, type EmailSection, type RenderedEmail } from './layout';
import type { Role } from '../../domain';
import { ROLE_LABELS } from '../../policy';

const fmtDate = (d: Date) => d.toISOString().slice(0, 10);

export function invitationEmail(p: {
  name: string;
  inviterName: string;
  role: Role;
  subsystems: string[];
  url: string;
  expiresAt: Date;
}): RenderedEmail {
  const owns = p.subsystems.length ? ` You will look after ${p.subsystems.join(', ')} this season.` : '';
  return renderEmail({
    subject: `${p.inviterName} invited you to Wakebook`,
    preheader: `Set a password to join your team's handover archive. The link works until ${fmtDate(p.expiresAt)}.`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `${p.inviterName} invited you to Wakebook, where your team keeps its decision records, lessons, guides and design calculations from season to season. You are joining as ${ROLE_LABELS[p.role].toLowerCase()}.${owns}`,
      `Open the link below and choose a password of at least 12 characters. The link works once, until ${fmtDate(p.expiresAt)} (UTC).`,
    ],
    action: { label: 'Accept the invitation', url: p.url },
    footer: [
      `You received this because a team lead entered this address in Wakebook.`,
      'If you did not expect it, ignore this message; nothing happens unless the link is opened and a password set.',
    ],
  });
}

export function resetEmail(p: { name: string; url: string; expiresAt: Date }): RenderedEmail {
  return renderEmail({
    subject: 'Reset your Wakebook password',
    preheader: 'Choose a new password. The link works once, for one hour.',
    greeting: `Hello ${p.name},`,
    paragraphs: [
      'Someone (we hope you) asked to reset the password of your Wakebook account. Open the link below to choose a new one.',
      `The link works once and only for one hour, until ${p.expiresAt.toISOString().slice(11, 16)} UTC. Setting a new password signs you out everywhere.`,
    ],
    action: { label: 'Choose a new password', url: p.url },
    footer: ['If you did not ask for this, ignore this message: your password stays as it is.'],
  });
}

export function digestEmail(p: {
  name: string;
  since: Date;
  sections: EmailSection[];
  accountUrl: string;
}): RenderedEmail {
  return renderEmail({
    subject: `Wakebook: your week since ${fmtDate(p.since)}`,
    preheader: p.sections.map((s) => `${s.items.length} ${s.heading.toLowerCase()}`).join(' · '),
    greeting: `Hello ${p.name},`,
    paragraphs: [`Here is what happened in your team's archive since ${fmtDate(p.since)}.`],
    sections: p.sections,
    footer: [`You receive this digest because you turned it on. Turn it off on your account page: ${p.accountUrl}`],
  });
}

/** Why a person is asked: they wrote the record, or they owned its subsystem in an earlier season. */
export type QuestionReason = 'author' | 'earlier-owner';

export function questionEmail(p: {
  name: string;
  askerName: string;
  recordTitle: string;
  subsystemName: string;
  body: string;
  reason: QuestionReason;
  url: string;
  accountUrl: string;
}): RenderedEmail {
  const why =
    p.reason === 'author'
      ? `You wrote “${p.recordTitle}”, so you may know the answer.`
      : `You looked after ${p.subsystemName} in an earlier season, so you may know the answer.`;
  return renderEmail({
    subject: `${p.askerName} asked about “${p.recordTitle}”`,
    preheader: p.body.slice(0, 120),
    greeting: `Hello ${p.name},`,
    paragraphs: [`${p.askerName} asked a question on “${p.recordTitle}” (${p.subsystemName}):`, p.body, why],
    action: { label: 'Read and answer', url: p.url },
    footer: [
      `You can turn off e-mails about new questions on your account page: ${p.accountUrl}`,
      'Answering is never required; even a short “we never tested that” helps the next team.',
    ],
  });
}

export function answerEmail(p: {
  name: string;
  answererName: string;
  recordTitle: string;
  question: string;
  body: string;
  url: string;
  accountUrl: string;
}): RenderedEmail {
  return renderEmail({
    subject: `${p.answererName} answered your question on “${p.recordTitle}”`,
    preheader: p.body.slice(0, 120),
    greeting: `Hello ${p.name},`,
    paragraphs: [`You asked: “${p.question}”`, `${p.answererName} answered:`, p.body],
    action: { label: 'Read the answer', url: p.url },
    footer: [
      'When your question is settled, mark it answered on the record so others can see it.',
      `You can turn off e-mails about answers on your account page: ${p.accountUrl}`,
    ],
  });
}
