import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { createContext } from 'astro/middleware';
import { db } from '../../src/lib/server/db/client';
import { sessions, users } from '../../src/lib/server/db/schema';
import {
  startSession,
  readSession,
  endAllSessions,
  SESSION_COOKIE,
  SESSION_LIFETIME_DAYS,
} from '../../src/lib/server/auth/lucia';
import { newId } from '../../src/lib/server/ids';

const DAY = 86_400;
let userId: string;

function jar(session?: string) {
  const headers = new Headers();
  if (session) headers.set('cookie', `${SESSION_COOKIE}=${session}`);
  return createContext({
    request: new Request('http://localhost/', { headers }),
    defaultLocale: '',
    locals: { user: null, session: null },
  }).cookies;
}

function setExpiry(id: string, secondsFromNow: number) {
  db()
    .update(sessions)
    .set({ expiresAt: Math.floor(Date.now() / 1000) + secondsFromNow })
    .where(eq(sessions.id, id))
    .run();
}

beforeAll(() => {
  userId = newId();
  db()
    .insert(users)
    .values({
      id: userId,
      email: 's@wakebook.test',
      name: 'Session Tester',
      role: 'member',
      passwordHash: 'x',
      createdAt: new Date(),
    })
    .run();
});

describe('sessions', () => {
  it('a new session lasts the configured lifetime and its cookie is HttpOnly and SameSite=Lax', async () => {
    const cookies = jar();
    const session = await startSession(userId, cookies);
    const header = [...cookies.headers()].join('\n');
    expect(header).toMatch(/HttpOnly/);
    expect(header).toMatch(/SameSite=Lax/);
    const days = (session.expiresAt.getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(SESSION_LIFETIME_DAYS - 0.01);
    expect(days).toBeLessThanOrEqual(SESSION_LIFETIME_DAYS);
  });

  it('an expired session signs nobody in and its cookie is cleared', async () => {
    const session = await startSession(userId, jar());
    setExpiry(session.id, -60);
    const cookies = jar(session.id);
    const { user } = await readSession(cookies);
    expect(user).toBeNull();
    expect([...cookies.headers()].join('\n')).toMatch(
      new RegExp(`${SESSION_COOKIE}=;|${SESSION_COOKIE}=\\s*;|Max-Age=0`),
    );
  });

  it('slides: a session used in its second half is extended', async () => {
    const session = await startSession(userId, jar());
    setExpiry(session.id, 2 * DAY); // well past half of 14 days
    const cookies = jar(session.id);
    const { user, session: read } = await readSession(cookies);
    expect(user?.id).toBe(userId);
    expect(read?.fresh).toBe(true);
    const stored = db().select().from(sessions).where(eq(sessions.id, session.id)).get()!;
    expect(stored.expiresAt - Date.now() / 1000).toBeGreaterThan((SESSION_LIFETIME_DAYS - 1) * DAY);
    expect([...cookies.headers()].join('\n')).toContain(session.id);
  });

  it('rotation: signing in again ends the session the browser held', async () => {
    const first = await startSession(userId, jar());
    const second = await startSession(userId, jar(first.id));
    expect(second.id).not.toBe(first.id);
    expect((await readSession(jar(first.id))).user).toBeNull();
    expect((await readSession(jar(second.id))).user?.id).toBe(userId);
  });

  it('endAllSessions signs a person out everywhere', async () => {
    const a = await startSession(userId, jar());
    const b = await startSession(userId, jar());
    await endAllSessions(userId);
    expect((await readSession(jar(a.id))).user).toBeNull();
    expect((await readSession(jar(b.id))).user).toBeNull();
  });
});
