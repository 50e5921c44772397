// The only module that knows about Lucia. Lucia 3 is no longer developed upstream (see
// docs/decisions/001-sessions-with-lucia-3.md); everything else asks these functions, so replacing it
// touches one file.
import { Lucia, TimeSpan, type DatabaseSession, type DatabaseUser, type Session, type User } from 'lucia';
import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import { eq } from 'drizzle-orm';
import type { AstroCookies } from 'astro';
import { db } from '../db/client';
import type { Role } from '../../domain';
import { sessions, users } from '../db/schema';
import { settings } from '../config';

export const SESSION_COOKIE = 'wakebook_session';
/** Sessions last this long since the last use; Lucia extends them once half is spent (sliding expiry). */
export const SESSION_LIFETIME_DAYS = 14;

/**
 * Lucia's Drizzle adapter, with the one query that runs on every request (session + user by session id) as a
 * statement prepared once. Everything else stays with the adapter.
 */
class PreparedSessionAdapter extends DrizzleSQLiteAdapter {
  private readonly lookup = db().$client.prepare(
    'SELECT s.id AS sid, s.user_id AS uid, s.expires_at AS exp, u.email AS email, u.name AS name, u.role AS role FROM sessions s JOIN users u ON u.id = s.user_id WHERE s.id = ?',
  );

  // better-sqlite3 answers synchronously; the adapter interface wants a promise.
  override getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = this.lookup.get(sessionId) as
      { sid: string; uid: string; exp: number; email: string; name: string; role: Role } | undefined;
    if (!row) return Promise.resolve([null, null]);
    return Promise.resolve([
      { id: row.sid, userId: row.uid, expiresAt: new Date(row.exp * 1000), attributes: {} },
      { id: row.uid, attributes: { email: row.email, name: row.name, role: row.role } },
    ]);
  }
}

function createLucia() {
  const adapter = new PreparedSessionAdapter(db(), sessions, users);
  const s = settings();
  const secure = s.WAKEBOOK_SECURE_COOKIES === 'auto' ? import.meta.env.PROD : s.WAKEBOOK_SECURE_COOKIES;
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(SESSION_LIFETIME_DAYS, 'd'),
    sessionCookie: { name: SESSION_COOKIE, expires: true, attributes: { secure, sameSite: 'lax' } },
    getUserAttributes: (a) => ({ email: a.email, name: a.name, role: a.role }),
  });
}

let instance: ReturnType<typeof createLucia> | undefined;
function lucia() {
  instance ??= createLucia();
  return instance;
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    DatabaseUserAttributes: { email: string; name: string; role: Role };
  }
}

export type { Session };

/** Starts a session for the user and sets its cookie. Any session the browser held before is ended (rotation). */
export async function startSession(userId: string, cookies: AstroCookies): Promise<Session> {
  const previous = cookies.get(SESSION_COOKIE)?.value;
  if (previous) await lucia().invalidateSession(previous);
  const session = await lucia().createSession(userId, {});
  const cookie = lucia().createSessionCookie(session.id);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
  return session;
}

/**
 * Reads the session cookie; refreshes the cookie when Lucia extended the session and clears it when it is invalid.
 */
export async function readSession(cookies: AstroCookies): Promise<{ user: User | null; session: Session | null }> {
  const id = cookies.get(SESSION_COOKIE)?.value ?? null;
  if (!id) return { user: null, session: null };
  const { session, user } = await lucia().validateSession(id);
  if (session?.fresh) {
    const cookie = lucia().createSessionCookie(session.id);
    cookies.set(cookie.name, cookie.value, cookie.attributes);
  }
  if (!session) {
    const blank = lucia().createBlankSessionCookie();
    cookies.set(blank.name, blank.value, blank.attributes);
  }
  return { user, session };
}

export async function endSession(sessionId: string | undefined, cookies: AstroCookies): Promise<void> {
  if (sessionId) await lucia().invalidateSession(sessionId);
  const blank = lucia().createBlankSessionCookie();
  cookies.set(blank.name, blank.value, blank.attributes);
}

/** Ends every session of a user (password reset, role removal). */
export async function endAllSessions(userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
}

export function countSessions(userId: string): number {
  return db().select().from(sessions).where(eq(sessions.userId, userId)).all().length;
}

/** Only for tests and tools that swap the database under a running process. */
export function resetAuthForTests(): void {
  instance = undefined;
}
