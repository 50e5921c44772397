import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as outbox from '../../src/pages/api/outbox';
import * as invitations from '../../src/pages/api/invitations/index';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('GET /api/outbox', () => {
  it('shows leads the captured mail, newest first, with both parts', async () => {
    for (const name of ['First Person', 'Second Person']) {
      const email = `${name.split(' ')[0].toLowerCase()}@northmere.example`;
      expect((await call(invitations, 'POST', { body: { email, name, role: 'member' }, session: s.lead })).status).toBe(
        201,
      );
    }
    const res = await call(outbox, 'GET', { session: s.lead });
    expect(res.status).toBe(200);
    const [newest, older] = res.body.messages;
    expect(newest.to).toBe('second@northmere.example');
    expect(older.to).toBe('first@northmere.example');
    expect(Object.keys(newest).sort()).toEqual(['html', 'sentAt', 'subject', 'text', 'to']);
    expect(newest.text).toContain('Hello Second Person');
    expect(newest.html).toMatch(/^<!doctype html>/);
    expect(Date.parse(newest.sentAt)).toBeGreaterThanOrEqual(Date.parse(older.sentAt));
  });

  it('escapes what people typed in the HTML part', async () => {
    await call(invitations, 'POST', {
      body: { email: 'tag@northmere.example', name: '<b>Bold</b> Name', role: 'member' },
      session: s.lead,
    });
    const res = await call(outbox, 'GET', { session: s.lead });
    expect(res.body.messages[0].html).toContain('&lt;b&gt;Bold&lt;/b&gt; Name');
    expect(res.body.messages[0].html).not.toContain('<b>Bold</b>');
  });

  it.each(['advisor', 'member', 'alumni'] as const)('refuses %s with 403', async (role) => {
    expect((await call(outbox, 'GET', { session: s[role] })).status).toBe(403);
  });

  it('refuses a signed-out caller with 401', async () => {
    expect((await call(outbox, 'GET')).status).toBe(401);
  });
});
