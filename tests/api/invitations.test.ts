import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import { latestMailTo, linkIn, mailCountTo, tokenIn } from '../setup/mail';
import * as invitationsRoute from '../../src/pages/api/invitations/index';
import * as invitationRoute from '../../src/pages/api/invitations/[id]/index';
import * as resendRoute from '../../src/pages/api/invitations/[id]/resend';
import * as revokeRoute from '../../src/pages/api/invitations/[id]/revoke';
import * as acceptRoute from '../../src/pages/api/auth/accept-invitation';
import * as me from '../../src/pages/api/me';
import * as audit from '../../src/pages/api/audit';
import * as signIn from '../../src/pages/api/auth/sign-in';
import { SESSION_COOKIE } from '../../src/lib/server/auth/lucia';
import { db } from '../../src/lib/server/db/client';
import { invitations, users, seasonMemberships, membershipSubsystems, seasons } from '../../src/lib/server/db/schema';
import { hashToken } from '../../src/lib/server/ids';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const GOOD_PASSWORD = 'lake-tern-ballast-42';

async function invite(email: string, extra: Record<string, unknown> = {}) {
  return call(invitationsRoute, 'POST', {
    body: { email, name: 'Ada Newcomer', role: 'member', ...extra },
    session: s.lead,
  });
}

describe('POST /api/invitations', () => {
  it('lets a lead invite: 201, the row stores only a hash, and the e-mail carries a single-use link', async () => {
    const res = await invite('Ada.Newcomer@Northmere.example', { subsystems: ['propulsion', 'battery'] });
    expect(res.status).toBe(201);
    expect(res.body.invitation).toMatchObject({
      email: 'ada.newcomer@northmere.example',
      name: 'Ada Newcomer',
      role: 'member',
      status: 'pending',
      subsystems: ['propulsion', 'battery'],
    });
    expect(res.body.mail.status).toBe('captured');
    expect(res.text).not.toMatch(/tokenHash|token_hash/);
    const expires = Date.parse(res.body.invitation.expiresAt) - Date.parse(res.body.invitation.createdAt);
    expect(expires).toBe(7 * 24 * 3600 * 1000);

    const mail = latestMailTo('ada.newcomer@northmere.example');
    expect(mail.subject).toContain('invited you to Wakebook');
    expect(mail.html).toContain('#115e56');
    expect(mail.html).toContain('#f6f1e6');
    expect(mail.text).toContain('Propulsion');
    const link = new URL(linkIn(mail.text));
    expect(link.origin).toBe('http://localhost:4321');
    expect(link.pathname).toMatch(/^\/invite\/[A-Za-z0-9_-]{20,}$/);
    const token = tokenIn(mail.text);
    expect(mail.html).toContain(token);
    const row = db().select().from(invitations).where(eq(invitations.id, res.body.invitation.id)).get()!;
    expect(row.tokenHash).toBe(hashToken(token));
    expect(row.tokenHash).not.toContain(token);
  });

  it('refuses a second pending invitation to the same address, and one to an existing account (409)', async () => {
    const again = await invite('ada.newcomer@northmere.example');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('conflict');
    const existing = await invite('member@wakebook.test');
    expect(existing.status).toBe(409);
  });

  it('names each bad field (400) and refuses unknown subsystems', async () => {
    const res = await call(invitationsRoute, 'POST', {
      body: { email: 'nope', name: '', role: 'captain' },
      session: s.lead,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'name', 'role']);
    const sub = await invite('someone.else@northmere.example', { subsystems: ['warp-drive'] });
    expect(sub.status).toBe(400);
    expect(sub.body.error.issues[0].path).toBe('subsystems');
  });

  it.each(['advisor', 'member', 'alumni'] as const)('refuses %s with 403', async (role) => {
    const res = await call(invitationsRoute, 'POST', {
      body: { email: 'x@northmere.example', name: 'X Person', role: 'member' },
      session: s[role],
    });
    expect(res.status).toBe(403);
    expect((await call(invitationsRoute, 'GET', { session: s[role] })).status).toBe(403);
  });

  it('refuses a signed-out caller with 401', async () => {
    expect(
      (await call(invitationsRoute, 'POST', { body: { email: 'x@northmere.example', name: 'X', role: 'member' } }))
        .status,
    ).toBe(401);
    expect((await call(invitationsRoute, 'GET')).status).toBe(401);
  });
});

describe('GET /api/invitations', () => {
  it('lists pending invitations for leads with whether their e-mail went out', async () => {
    const res = await call(invitationsRoute, 'GET', { session: s.lead });
    expect(res.status).toBe(200);
    const ada = res.body.invitations.find((i: { email: string }) => i.email === 'ada.newcomer@northmere.example');
    expect(ada).toMatchObject({ status: 'pending', invitedBy: 'Maren Kowalczyk' });
    expect(ada.mail.status).toBe('captured');
  });
});

describe('POST /api/auth/accept-invitation', () => {
  it('refuses a short or common password with the field named, and leaves the invitation open', async () => {
    await invite('bo.short@northmere.example');
    const token = tokenIn(latestMailTo('bo.short@northmere.example').text);
    const short = await call(acceptRoute, 'POST', { body: { token, password: 'short-pw' } });
    expect(short.status).toBe(400);
    expect(short.body.error.issues).toEqual([
      expect.objectContaining({ path: 'password', message: expect.stringContaining('12 characters') }),
    ]);
    const common = await call(acceptRoute, 'POST', { body: { token, password: 'qwerty123456' } });
    expect(common.status).toBe(400);
    expect(common.body.error.issues[0].message).toContain('common passwords');
    const ok = await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD } });
    expect(ok.status).toBe(201);
  });

  it('creates the account with a membership in the current season, signs the person in, and audits it', async () => {
    await invite('cy.owner@northmere.example', { role: 'member', subsystems: ['solar'], name: 'Cy Owner' });
    const token = tokenIn(latestMailTo('cy.owner@northmere.example').text);
    const res = await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD, name: 'Cy Ownerson' } });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'cy.owner@northmere.example', name: 'Cy Ownerson', role: 'member' });
    const session = res.cookies.get(SESSION_COOKIE);
    expect(session).toBeTruthy();
    const who = await call(me, 'GET', { session });
    expect(who.status).toBe(200);
    expect(who.body.user.email).toBe('cy.owner@northmere.example');

    const user = db().select().from(users).where(eq(users.email, 'cy.owner@northmere.example')).get()!;
    const current = db().select().from(seasons).where(eq(seasons.isCurrent, true)).get()!;
    const m = db().select().from(seasonMemberships).where(eq(seasonMemberships.userId, user.id)).all();
    expect(m).toHaveLength(1);
    expect(m[0]).toMatchObject({ seasonId: current.id, role: 'member' });
    expect(
      db()
        .select()
        .from(membershipSubsystems)
        .where(eq(membershipSubsystems.membershipId, m[0].id))
        .all()
        .map((x) => x.subsystemSlug),
    ).toEqual(['solar']);

    const signInAgain = await call(signIn, 'POST', {
      body: { email: 'cy.owner@northmere.example', password: GOOD_PASSWORD },
      ip: '127.0.9.1',
    });
    expect(signInAgain.status).toBe(200);

    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'invitation.' } });
    const actions = log.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toContain('invitation.accept');
    expect(actions).toContain('invitation.create');
  });

  it('refuses a used token (400) and a token never issued (404)', async () => {
    await invite('di.twice@northmere.example');
    const token = tokenIn(latestMailTo('di.twice@northmere.example').text);
    expect((await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD } })).status).toBe(201);
    const again = await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD } });
    expect(again.status).toBe(400);
    expect(again.body.error.reason).toBe('used');
    expect(again.cookies.get(SESSION_COOKIE)).toBeUndefined();
    const wrong = await call(acceptRoute, 'POST', { body: { token: 'A'.repeat(27), password: GOOD_PASSWORD } });
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.code).toBe('not_found');
    const malformed = await call(acceptRoute, 'POST', { body: { token: 'short', password: GOOD_PASSWORD } });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.issues[0].path).toBe('token');
  });

  it('refuses an expired token (400 expired)', async () => {
    const created = await invite('ed.late@northmere.example');
    const token = tokenIn(latestMailTo('ed.late@northmere.example').text);
    db()
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, created.body.invitation.id))
      .run();
    const res = await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD } });
    expect(res.status).toBe(400);
    expect(res.body.error.reason).toBe('expired');
    expect(db().select().from(users).where(eq(users.email, 'ed.late@northmere.example')).get()).toBeUndefined();
  });
});

describe('resend and revoke', () => {
  it('resend mails a fresh link, the old one stops working, and the expiry starts again', async () => {
    const created = await invite('fay.resend@northmere.example');
    const id = created.body.invitation.id;
    const oldToken = tokenIn(latestMailTo('fay.resend@northmere.example').text);
    db()
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, id))
      .run();
    const res = await call(resendRoute, 'POST', { params: { id }, session: s.lead });
    expect(res.status).toBe(200);
    expect(res.body.invitation.status).toBe('pending');
    expect(mailCountTo('fay.resend@northmere.example')).toBe(2);
    const newToken = tokenIn(latestMailTo('fay.resend@northmere.example').text);
    expect(newToken).not.toBe(oldToken);
    expect((await call(acceptRoute, 'POST', { body: { token: oldToken, password: GOOD_PASSWORD } })).status).toBe(404);
    expect((await call(acceptRoute, 'POST', { body: { token: newToken, password: GOOD_PASSWORD } })).status).toBe(201);
    const accepted = await call(resendRoute, 'POST', { params: { id }, session: s.lead });
    expect(accepted.status).toBe(409);
  });

  it('revoke (DELETE or POST …/revoke) makes the link refuse with reason revoked; it cannot be resent', async () => {
    const created = await invite('gus.revoked@northmere.example');
    const id = created.body.invitation.id;
    const token = tokenIn(latestMailTo('gus.revoked@northmere.example').text);
    const res = await call(invitationRoute, 'DELETE', { params: { id }, session: s.lead });
    expect(res.status).toBe(200);
    expect(res.body.invitation.status).toBe('revoked');
    const accept = await call(acceptRoute, 'POST', { body: { token, password: GOOD_PASSWORD } });
    expect(accept.status).toBe(400);
    expect(accept.body.error.reason).toBe('revoked');
    expect((await call(resendRoute, 'POST', { params: { id }, session: s.lead })).status).toBe(409);
    expect((await call(revokeRoute, 'POST', { params: { id }, session: s.lead })).status).toBe(200);

    const other = await invite('hal.revoked@northmere.example');
    const viaPost = await call(revokeRoute, 'POST', { params: { id: other.body.invitation.id }, session: s.lead });
    expect(viaPost.body.invitation.status).toBe('revoked');
  });

  it('answers 404 for an unknown invitation and 403 for non-leads', async () => {
    expect((await call(resendRoute, 'POST', { params: { id: 'nope' }, session: s.lead })).status).toBe(404);
    expect((await call(invitationRoute, 'DELETE', { params: { id: 'nope' }, session: s.lead })).status).toBe(404);
    expect((await call(invitationRoute, 'DELETE', { params: { id: 'nope' }, session: s.member })).status).toBe(403);
    expect((await call(resendRoute, 'POST', { params: { id: 'nope' }, session: s.advisor })).status).toBe(403);
  });
});
