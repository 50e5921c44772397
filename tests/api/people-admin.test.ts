import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, demoAccounts, type DemoRole } from '../setup/db';
import * as person from '../../src/pages/api/people/[id]';
import * as people from '../../src/pages/api/people/index';
import * as audit from '../../src/pages/api/audit';
import * as me from '../../src/pages/api/me';
import { db } from '../../src/lib/server/db/client';
import { users } from '../../src/lib/server/db/schema';
import { queryPeople } from '../../src/lib/server/people-admin';
import { peopleQuerySchema } from '../../src/lib/schemas/people';

let s: Record<DemoRole, string>;
const idOf = (email: string) => db().select().from(users).where(eq(users.email, email)).get()!.id;

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('PATCH /api/people/{id}', () => {
  it('lets a lead change a role; the change is audited and the person list shows it', async () => {
    const id = idOf(demoAccounts.member);
    const res = await call(person, 'PATCH', { params: { id }, body: { role: 'advisor' }, session: s.lead });
    expect(res.status).toBe(200);
    expect(res.body.person.role).toBe('advisor');
    const current = res.body.person.seasons[0];
    expect(current.role).toBe('advisor');
    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'person.role-change' } });
    expect(log.body.entries[0]).toMatchObject({
      action: 'person.role-change',
      target: `user:${id}`,
      actor: demoAccounts.lead,
    });
    expect(log.body.entries[0].detail).toMatchObject({ from: 'member', to: 'advisor' });
    await call(person, 'PATCH', { params: { id }, body: { role: 'member' }, session: s.lead });
  });

  it('replaces the current-season subsystems of a person', async () => {
    const id = idOf(demoAccounts.member);
    const res = await call(person, 'PATCH', {
      params: { id },
      body: { subsystems: ['cooling', 'telemetry', 'cooling'] },
      session: s.lead,
    });
    expect(res.status).toBe(200);
    expect(res.body.person.seasons[0].subsystems.map((x: { slug: string }) => x.slug).sort()).toEqual([
      'cooling',
      'telemetry',
    ]);
    const cleared = await call(person, 'PATCH', { params: { id }, body: { subsystems: [] }, session: s.lead });
    expect(cleared.body.person.seasons[0].subsystems).toEqual([]);
    const bad = await call(person, 'PATCH', { params: { id }, body: { subsystems: ['warp-drive'] }, session: s.lead });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('subsystems');
  });

  it('refuses to remove the last lead with 409, and allows it once another lead exists', async () => {
    const lead = idOf(demoAccounts.lead);
    const leads = db().select().from(users).where(eq(users.role, 'lead')).all();
    expect(leads).toHaveLength(1);
    const res = await call(person, 'PATCH', { params: { id: lead }, body: { role: 'member' }, session: s.lead });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(db().select().from(users).where(eq(users.id, lead)).get()!.role).toBe('lead');

    const advisor = idOf(demoAccounts.advisor);
    expect(
      (await call(person, 'PATCH', { params: { id: advisor }, body: { role: 'lead' }, session: s.lead })).status,
    ).toBe(200);
    expect(
      (await call(person, 'PATCH', { params: { id: lead }, body: { role: 'alumni' }, session: s.lead })).status,
    ).toBe(200);
    // The former lead's session now carries the new role: no more admin.
    expect(
      (await call(person, 'PATCH', { params: { id: advisor }, body: { role: 'member' }, session: s.lead })).status,
    ).toBe(403);
    expect((await call(me, 'GET', { session: s.lead })).body.user.role).toBe('alumni');
    // Put things back for the other tests.
    expect(
      (await call(person, 'PATCH', { params: { id: lead }, body: { role: 'lead' }, session: s.advisor })).status,
    ).toBe(200);
    expect(
      (await call(person, 'PATCH', { params: { id: advisor }, body: { role: 'advisor' }, session: s.lead })).status,
    ).toBe(200);
  });

  it('answers 400 to an empty patch, 404 to an unknown person, 403 to non-leads and 401 signed out', async () => {
    const id = idOf(demoAccounts.member);
    expect((await call(person, 'PATCH', { params: { id }, body: {}, session: s.lead })).status).toBe(400);
    expect((await call(person, 'PATCH', { params: { id }, body: { role: 'captain' }, session: s.lead })).status).toBe(
      400,
    );
    expect(
      (await call(person, 'PATCH', { params: { id: 'nobody' }, body: { role: 'member' }, session: s.lead })).status,
    ).toBe(404);
    for (const role of ['advisor', 'member', 'alumni'] as const) {
      expect((await call(person, 'PATCH', { params: { id }, body: { role: 'lead' }, session: s[role] })).status).toBe(
        403,
      );
    }
    expect((await call(person, 'PATCH', { params: { id }, body: { role: 'lead' } })).status).toBe(401);
  });
});

describe('the people directory and the admin query', () => {
  it('shows everyone with seasons and subsystems; addresses only to leads', async () => {
    const asMember = await call(people, 'GET', { session: s.member });
    expect(asMember.status).toBe(200);
    expect(asMember.body.people.length).toBeGreaterThanOrEqual(4);
    expect(asMember.body.people.every((p: { email?: string }) => p.email === undefined)).toBe(true);
    const alumni = asMember.body.people.find((p: { role: string }) => p.role === 'alumni');
    expect(alumni.seasons.length).toBeGreaterThan(0);
    const asLead = await call(people, 'GET', { session: s.lead });
    expect(asLead.body.people.every((p: { email?: string }) => typeof p.email === 'string')).toBe(true);
  });

  it('filters, sorts and pages on the server', () => {
    const all = queryPeople(peopleQuerySchema.parse({ perPage: '200' }));
    expect(all.total).toBe(all.people.length);
    const names = all.people.map((p) => p.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b)));
    const alumni = queryPeople(peopleQuerySchema.parse({ role: 'alumni' }));
    expect(alumni.people.length).toBeGreaterThan(0);
    expect(alumni.people.every((p) => p.role === 'alumni')).toBe(true);
    const byRole = queryPeople(peopleQuerySchema.parse({ sort: 'role', perPage: '200' }));
    expect(byRole.people[0].role).toBe('lead');
    const desc = queryPeople(peopleQuerySchema.parse({ sort: 'role', dir: 'desc', perPage: '200' }));
    expect(desc.people[0].role).toBe('alumni');
    const page2 = queryPeople(peopleQuerySchema.parse({ perPage: '5', page: '2' }));
    expect(page2.page).toBe(2);
    expect(page2.people.map((p) => p.name)).toEqual(names.slice(5, 10));
    const found = queryPeople(peopleQuerySchema.parse({ q: 'kowalczyk' }));
    expect(found.people.map((p) => p.email)).toEqual([demoAccounts.lead]);
  });
});

describe('PATCH /api/me', () => {
  it('turns the digest on and off for oneself and validates the body', async () => {
    const on = await call(me, 'PATCH', { body: { digestOptIn: true }, session: s.alumni });
    expect(on.status).toBe(200);
    expect(on.body.digestOptIn).toBe(true);
    expect(db().select().from(users).where(eq(users.email, demoAccounts.alumni)).get()!.digestOptIn).toBe(true);
    const off = await call(me, 'PATCH', { body: { digestOptIn: false }, session: s.alumni });
    expect(off.body.digestOptIn).toBe(false);
    expect((await call(me, 'PATCH', { body: { digestOptIn: 'yes' }, session: s.alumni })).status).toBe(400);
    expect((await call(me, 'PATCH', { body: { digestOptIn: true } })).status).toBe(401);
  });
});
