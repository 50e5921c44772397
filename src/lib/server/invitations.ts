import { and, desc, eq, gt, inArray, isNull, or, sql } from 'drizzle-orm';
import type { AstroCookies } from 'astro';
import { db, prepared } from './db/client';
import type { Role } from '../domain';
import { auditEntries, invitations, membershipSubsystems, seasonMemberships, subsystems, users } from './db/schema';
import { conflict, invalidInput, notFound } from './http';
import { hashToken, newId, newToken } from './ids';
import { recordAudit } from './audit';
import { currentSeason } from './seasons';
import { hashPassword } from './auth/password';
import { startSession } from './auth/lucia';
import { normaliseEmail } from './auth/sign-in';
import { sendMail, type MailResult } from './mail/send';
import { invitationEmail } from './mail/messages';
import { latestMailTo } from './mail/outbox';
import { linkError, type SpentReason } from './link-tokens';
import { toPublicUser, type PublicUser } from './users';
import type { InvitationInput } from '../schemas/people';
import type { AcceptInvitationInput } from './auth/new-password';

export const INVITATION_DAYS = 7;
const DAY_MS = 24 * 3600 * 1000;
/** Accepted, revoked and expired invitations stay in the list this long, so a lead sees what happened. */
const RECENT_DAYS = 30;

type Actor = { id: string; email: string; name: string };
type InvitationRow = typeof invitations.$inferSelect;
export type InvitationStatus = 'pending' | 'accepted' | 'expired' | 'revoked';

export interface InvitationView {
  id: string;
  email: string;
  name: string;
  role: Role;
  subsystems: string[];
  status: InvitationStatus;
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
  revokedAt: string | null;
  /** The latest e-mail to this address: whether it went out. */
  mail: { status: string; error: string | null; sentAt: string } | null;
}

function statusOf(r: InvitationRow, now = new Date()): InvitationStatus {
  if (r.acceptedAt) return 'accepted';
  if (r.revokedAt) return 'revoked';
  if (r.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'pending';
}

function toView(r: InvitationRow, inviter: string | null, mail: InvitationView['mail']): InvitationView {
  return {
    id: r.id,
    email: r.email,
    name: r.name,
    role: r.role,
    subsystems: r.subsystems,
    status: statusOf(r),
    invitedBy: inviter,
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    acceptedAt: r.acceptedAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
    mail,
  };
}

/** Pending invitations and those settled in the last 30 days, newest first. */
export function listInvitations(): InvitationView[] {
  const since = new Date(Date.now() - RECENT_DAYS * DAY_MS);
  const rows = db()
    .select({ i: invitations, inviter: users.name })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(
      or(
        and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt)),
        gt(invitations.createdAt, since),
        gt(invitations.acceptedAt, since),
        gt(invitations.revokedAt, since),
      ),
    )
    .orderBy(desc(invitations.createdAt))
    .all();
  const mail = latestMailTo([...new Set(rows.map((r) => r.i.email))]);
  return rows.map((r) => toView(r.i, r.inviter, mail.get(r.i.email) ?? null));
}

export function getInvitation(id: string): InvitationView | null {
  const row = db()
    .select({ i: invitations, inviter: users.name })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(eq(invitations.id, id))
    .get();
  if (!row) return null;
  return toView(row.i, row.inviter, latestMailTo([row.i.email]).get(row.i.email) ?? null);
}

function checkSubsystems(slugs: string[]): void {
  if (slugs.length === 0) return;
  const known = new Set(
    db()
      .select({ slug: subsystems.slug })
      .from(subsystems)
      .where(inArray(subsystems.slug, slugs))
      .all()
      .map((s) => s.slug),
  );
  const unknown = slugs.filter((s) => !known.has(s));
  if (unknown.length)
    throw invalidInput([{ path: 'subsystems', message: `No such subsystem: ${unknown.join(', ')}.` }]);
}

function inviteLink(base: string, token: string): string {
  return `${base}/invite/${token}`;
}

async function mailInvitation(r: InvitationRow, token: string, inviterName: string, base: string): Promise<MailResult> {
  const names = r.subsystems.length
    ? db()
        .select({ slug: subsystems.slug, name: subsystems.name })
        .from(subsystems)
        .where(inArray(subsystems.slug, r.subsystems))
        .all()
        .map((s) => s.name)
    : [];
  return sendMail(
    r.email,
    invitationEmail({
      name: r.name,
      inviterName,
      role: r.role,
      subsystems: names,
      url: inviteLink(base, token),
      expiresAt: r.expiresAt,
    }),
  );
}

/** Saves the invitation first, then mails it: a mail failure leaves the invitation in place to be resent. */
export async function createInvitation(
  input: InvitationInput,
  actor: Actor,
  base: string,
): Promise<{ invitation: InvitationView; mail: MailResult }> {
  const email = normaliseEmail(input.email);
  checkSubsystems(input.subsystems);
  if (db().select({ id: users.id }).from(users).where(eq(users.email, email)).get()) {
    throw conflict(
      'Someone with that e-mail address already has an account. Change their role on the people page instead.',
    );
  }
  const open = db()
    .select()
    .from(invitations)
    .where(
      and(
        eq(invitations.email, email),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    )
    .get();
  if (open)
    throw conflict('That address already has a pending invitation. Resend it or revoke it first.', {
      invitationId: open.id,
    });
  const token = newToken();
  const now = new Date();
  const row: InvitationRow = {
    id: newId(),
    email,
    name: input.name,
    role: input.role,
    subsystems: input.subsystems,
    tokenHash: hashToken(token),
    invitedById: actor.id,
    createdAt: now,
    expiresAt: new Date(now.getTime() + INVITATION_DAYS * DAY_MS),
    acceptedAt: null,
    acceptedUserId: null,
    revokedAt: null,
  };
  db().insert(invitations).values(row).run();
  recordAudit({
    actor,
    action: 'invitation.create',
    targetType: 'invitation',
    targetId: row.id,
    detail: { email, role: input.role, subsystems: input.subsystems },
  });
  const mail = await mailInvitation(row, token, actor.name, base);
  return { invitation: getInvitation(row.id)!, mail };
}

/** A fresh link and seven fresh days; the previous link stops working. Accepted or revoked ones cannot be resent. */
export async function resendInvitation(
  id: string,
  actor: Actor,
  base: string,
): Promise<{ invitation: InvitationView; mail: MailResult }> {
  const row = db().select().from(invitations).where(eq(invitations.id, id)).get();
  if (!row) throw notFound('That invitation');
  const status = statusOf(row);
  if (status === 'accepted' || status === 'revoked')
    throw conflict(`That invitation was ${status}; it cannot be sent again. Invite the person anew if needed.`);
  const token = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * DAY_MS);
  db()
    .update(invitations)
    .set({ tokenHash: hashToken(token), expiresAt })
    .where(eq(invitations.id, id))
    .run();
  recordAudit({
    actor,
    action: 'invitation.resend',
    targetType: 'invitation',
    targetId: id,
    detail: { email: row.email },
  });
  const mail = await mailInvitation({ ...row, expiresAt }, token, actor.name, base);
  return { invitation: getInvitation(id)!, mail };
}

export function revokeInvitation(id: string, actor: Actor): InvitationView {
  const row = db().select().from(invitations).where(eq(invitations.id, id)).get();
  if (!row) throw notFound('That invitation');
  if (row.acceptedAt)
    throw conflict('That invitation was already accepted; change the person’s role on the people page instead.');
  if (!row.revokedAt) {
    db().update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, id)).run();
    recordAudit({
      actor,
      action: 'invitation.revoke',
      targetType: 'invitation',
      targetId: id,
      detail: { email: row.email },
    });
  }
  return getInvitation(id)!;
}

export type TokenCheck = { state: 'valid'; invitation: InvitationRow } | { state: SpentReason | 'unknown' };

/** What an invitation link leads to, for the accept page and the API. */
export function checkInvitationToken(token: string): TokenCheck {
  const row = db()
    .select()
    .from(invitations)
    .where(eq(invitations.tokenHash, hashToken(token)))
    .get();
  if (!row) return { state: 'unknown' };
  const status = statusOf(row);
  if (status === 'accepted') return { state: 'used' };
  if (status === 'revoked' || status === 'expired') return { state: status };
  return { state: 'valid', invitation: row };
}

/**
 * Creates the account, a membership in the current season with the invited subsystems, marks the invitation used
 * and signs the person in. The invitation is claimed inside the transaction, so two clicks cannot make two accounts.
 */
export async function acceptInvitation(
  input: AcceptInvitationInput,
  cookies: AstroCookies,
  ip: string,
): Promise<PublicUser> {
  const check = checkInvitationToken(input.token);
  if (check.state !== 'valid') throw linkError(check.state);
  const inv = check.invitation;
  const passwordHash = await hashPassword(input.password);
  const userId = newId();
  const now = new Date();
  const season = currentSeason();
  db().transaction((tx) => {
    if (tx.select({ id: users.id }).from(users).where(eq(users.email, inv.email)).get()) {
      throw conflict(
        'An account with this e-mail address already exists. Sign in instead, or ask for a password reset.',
      );
    }
    tx.insert(users)
      .values({
        id: userId,
        email: inv.email,
        name: input.name ?? inv.name,
        role: inv.role,
        passwordHash,
        createdAt: now,
        lastSignInAt: now,
        digestOptIn: false,
      })
      .run();
    // Claimed only if still open and still this link (a resend replaces the hash); otherwise everything rolls back.
    const claimed = tx
      .update(invitations)
      .set({ acceptedAt: now, acceptedUserId: userId })
      .where(
        and(
          eq(invitations.id, inv.id),
          eq(invitations.tokenHash, inv.tokenHash),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
          gt(invitations.expiresAt, now),
        ),
      )
      .run();
    if (claimed.changes !== 1) throw linkError('used');
    if (season) {
      const membershipId = newId();
      tx.insert(seasonMemberships).values({ id: membershipId, seasonId: season.id, userId, role: inv.role }).run();
      const existing = inv.subsystems.length
        ? tx.select({ slug: subsystems.slug }).from(subsystems).where(inArray(subsystems.slug, inv.subsystems)).all()
        : [];
      for (const s of existing) tx.insert(membershipSubsystems).values({ membershipId, subsystemSlug: s.slug }).run();
    }
  });
  await startSession(userId, cookies);
  const actor = { id: userId, email: inv.email };
  recordAudit({
    actor,
    action: 'invitation.accept',
    targetType: 'invitation',
    targetId: inv.id,
    detail: { role: inv.role, subsystems: inv.subsystems, season: season?.name ?? null },
    ip,
  });
  return toPublicUser({ id: userId, email: inv.email, name: input.name ?? inv.name, role: inv.role });
}

/**
 * Someone who joined through an invitation and has signed in at most once since (the invitation's own session
 * does not count): their home page welcomes them and starts their onboarding instead of "welcome back".
 */
export function isNewInvitee(userId: string): boolean {
  // On every home page: prepared once (building and preparing it cost more than running it).
  const rows = prepared('invitations.isNewInvitee', (d) =>
    d
      .select({ action: auditEntries.action, n: sql<number>`count(*)` })
      .from(auditEntries)
      .where(
        and(
          eq(auditEntries.actorId, sql.placeholder('userId')),
          inArray(auditEntries.action, ['invitation.accept', 'auth.sign-in']),
        ),
      )
      .groupBy(auditEntries.action)
      .prepare(),
  ).all({ userId });
  const count = (a: string) => rows.find((r) => r.action === a)?.n ?? 0;
  return count('invitation.accept') > 0 && count('auth.sign-in') <= 1;
}
