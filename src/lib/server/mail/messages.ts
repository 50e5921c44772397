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

export function passwordChangedEmail(p: { name: string; at: Date; otherSessions: number; resetUrl: string }) {
  const others =
    p.otherSessions === 0
      ? 'You were not signed in anywhere else.'
      : `${p.otherSessions === 1 ? 'One other device or browser was' : `${p.otherSessions} other devices or browsers were`} signed out.`;
  return renderEmail({
    subject: 'Your Wakebook password was changed',
    preheader: `Changed on ${fmtDate(p.at)} at ${p.at.toISOString().slice(11, 16)} UTC.`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `The password of your Wakebook account was changed on ${fmtDate(p.at)} at ${p.at.toISOString().slice(11, 16)} UTC, by someone signed in as you who knew the old one. ${others}`,
      'If that was you, there is nothing more to do.',
      'If it was not you, choose a new password now with the link below (it sends a reset link to this address), and tell one of your team leads.',
    ],
    action: { label: 'Reset my password', url: p.resetUrl },
    footer: ['You receive this message whenever your password changes; it cannot be turned off.'],
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

export function onboardingNudgeEmail(p: {
  name: string;
  leadName: string;
  routes: { name: string; done: number; total: number; url: string }[];
  note?: string;
}): RenderedEmail {
  const first = p.routes.find((r) => r.done < r.total) ?? p.routes[0];
  return renderEmail({
    subject: `${p.leadName} asks you to carry on with your onboarding`,
    preheader: first ? `${first.name}: ${first.done} of ${first.total} done.` : 'Your onboarding route is waiting.',
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `${p.leadName} is checking how the new members are getting on and asks you to carry on with your onboarding route in Wakebook: the guides, records and calculations the team picked for newcomers, in order.`,
      ...(p.note ? [p.note] : []),
      p.routes.length
        ? `Where you are: ${p.routes.map((r) => `${r.name} ${r.done} of ${r.total}`).join('; ')}.`
        : 'You have no subsystem yet; every subsystem page has a route you can follow.',
    ],
    ...(first ? { action: { label: `Open the ${first.name} route`, url: first.url } } : {}),
    footer: ['You received this because a team lead sent you a reminder from the onboarding progress page.'],
  });
}
