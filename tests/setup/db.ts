import { seedDemoIfEmpty } from '../../src/lib/server/demo/seed';
import { DEMO_PASSWORD } from '../../src/lib/server/demo/team';
import * as signIn from '../../src/pages/api/auth/sign-in';
import { call } from './http';
import { SESSION_COOKIE } from '../../src/lib/server/auth/lucia';

export const demoAccounts = {
  lead: 'lead@wakebook.test',
  advisor: 'advisor@wakebook.test',
  member: 'member@wakebook.test',
  alumni: 'alumni@wakebook.test',
} as const;
export type DemoRole = keyof typeof demoAccounts;

/** Seeds the demo team into this test file's database (once). */
export async function seedDemo(): Promise<void> {
  await seedDemoIfEmpty();
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
