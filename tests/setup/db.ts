import { copyFileSync, cpSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { inject } from 'vitest';
import { closeDatabase, db } from '../../src/lib/server/db/client';
import { settings } from '../../src/lib/server/config';
import { DEMO_PASSWORD } from '../../src/lib/server/demo/team';
import * as signIn from '../../src/pages/api/auth/sign-in';
import { call } from './http';
import { resetAuthForTests, SESSION_COOKIE } from '../../src/lib/server/auth/lucia';

export const demoAccounts = {
  lead: 'lead@wakebook.test',
  advisor: 'advisor@wakebook.test',
  member: 'member@wakebook.test',
  alumni: 'alumni@wakebook.test',
} as const;
export type DemoRole = keyof typeof demoAccounts;

/**
 * Gives this test file the demo team: while its database has no users yet, it is replaced by a copy of the
 * seeded template (and its uploads) built once per run by global-db.ts. With users present it does nothing, as
 * the seed itself would. The app reopens the database on its next use.
 */
export function seedDemo(): Promise<void> {
  if (db().$client.prepare('select 1 from users limit 1').get()) return Promise.resolve();
  closeDatabase();
  resetAuthForTests(); // Lucia's adapter holds the connection just closed
  const { WAKEBOOK_DB, WAKEBOOK_UPLOADS } = settings();
  const templates = inject('templateDir');
  for (const suffix of ['-wal', '-shm']) rmSync(WAKEBOOK_DB + suffix, { force: true });
  copyFileSync(join(templates, 'demo.db'), WAKEBOOK_DB);
  cpSync(join(templates, 'demo-uploads'), WAKEBOOK_UPLOADS, { recursive: true });
  return Promise.resolve();
}

/** Signs a demo account in through the real route and returns its session cookie value. */
export async function sessionFor(role: DemoRole): Promise<string> {
  const res = await call(signIn, 'POST', {
    body: { email: demoAccounts[role], password: DEMO_PASSWORD },
    ip: `127.0.1.${role.length}`,
  });
  const session = res.cookies.get(SESSION_COOKIE);
  if (res.status !== 200 || !session) throw new Error(`sign-in as ${role} failed: ${res.status} ${res.text}`);
  return session;
}

export async function sessionsForAllRoles(): Promise<Record<DemoRole, string>> {
  const out = {} as Record<DemoRole, string>;
  for (const role of Object.keys(demoAccounts) as DemoRole[]) out[role] = await sessionFor(role);
  return out;
}
