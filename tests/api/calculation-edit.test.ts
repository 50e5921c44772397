// PATCH and DELETE /api/calculations/{id} (API.md, second round, issue 11): its author or a lead, members only in
// the current season; 409 while an accepted decision record links it.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as calculationsRoute from '../../src/pages/api/calculations/index';
import * as calculationRoute from '../../src/pages/api/calculations/[id]/index';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as status from '../../src/pages/api/records/[id]/status';
import * as search from '../../src/pages/api/search';
import * as audit from '../../src/pages/api/audit';
import { templateFor } from '../../src/lib/editor/templates';
import { db } from '../../src/lib/server/db/client';
import { calculations } from '../../src/lib/server/db/schema';
import { listSeasons } from '../../src/lib/server/seasons';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const cable = { current_A: 80, length_m: 2, crossSection_mm2: 16, temperature_C: 40, systemVoltage_V: 48 };

async function save(role: DemoRole = 'member', title = 'Main cable for the quarter-final') {
  const res = await call(calculationsRoute, 'POST', {
    session: s[role],
    body: { kind: 'cable', title, subsystem: 'battery', inputs: cable, notes: 'first notes' },
  });
  expect(res.status).toBe(201);
  return res.body.calculation as { id: string; title: string };
}

const patch = (role: DemoRole, id: string, body: unknown) =>
  call(calculationRoute, 'PATCH', { session: s[role], params: { id }, body });
const remove = (role: DemoRole, id: string) => call(calculationRoute, 'DELETE', { session: s[role], params: { id } });

describe('PATCH /api/calculations/{id}', () => {
  it('lets its author rename, re-note and move it; inputs and outputs stay as computed', async () => {
    const c = await save();
    const before = (await call(calculationRoute, 'GET', { session: s.member, params: { id: c.id } })).body.calculation;
    const res = await patch('member', c.id, {
      title: 'Main cable, final choice',
      notes: 'Measured 2.1 m in the hull.',
      subsystem: 'steering',
    });
    expect(res.status).toBe(200);
    expect(res.body.calculation).toMatchObject({
      title: 'Main cable, final choice',
      notes: 'Measured 2.1 m in the hull.',
      subsystem: 'steering',
    });
    expect(res.body.calculation.inputs).toEqual(before.inputs);
    expect(res.body.calculation.outputs).toEqual(before.outputs);
    // Only what was sent changes.
    const again = await patch('member', c.id, { notes: '' });
    expect(again.body.calculation).toMatchObject({
      title: 'Main cable, final choice',
      notes: '',
      subsystem: 'steering',
    });
  });

  it('refuses others: alumni and advisors 403, a member on someone else’s calculation 403, a lead may', async () => {
    const byLead = await save('lead', 'Lead’s cable check');
    for (const role of ['alumni', 'advisor', 'member'] as const)
      expect((await patch(role, byLead.id, { title: 'Taken over' })).status, role).toBe(403);
    const mine = await save('member');
    const lead = await patch('lead', mine.id, { title: 'Tidied by the lead' });
    expect(lead.status).toBe(200);
    expect(lead.body.calculation.title).toBe('Tidied by the lead');
  });

  it('refuses a member once the calculation’s season is no longer current; a lead still may', async () => {
    const c = await save();
    const past = listSeasons().find((x) => !x.current)!;
    db().update(calculations).set({ seasonId: past.id }).where(eq(calculations.id, c.id)).run();
    expect((await patch('member', c.id, { title: 'Rewriting the past' })).status).toBe(403);
    expect((await remove('member', c.id)).status).toBe(403);
    expect((await patch('lead', c.id, { title: 'Archived cable check' })).status).toBe(200);
  });

  it('answers 400 with the field for bad input, 404 for an unknown id, and keeps what was saved', async () => {
    const c = await save();
    const short = await patch('member', c.id, { title: 'x' });
    expect(short.status).toBe(400);
    expect(short.body.error.issues[0].path).toBe('title');
    const nowhere = await patch('member', c.id, { subsystem: 'no-such-subsystem' });
    expect(nowhere.status).toBe(400);
    expect(nowhere.body.error.issues[0].path).toBe('subsystem');
    expect((await patch('member', c.id, {})).status).toBe(400);
    expect((await patch('member', c.id, { inputs: { current_A: 1 } })).status).toBe(400);
    expect((await patch('member', 'nope', { title: 'Nothing here' })).status).toBe(404);
    const kept = (await call(calculationRoute, 'GET', { session: s.member, params: { id: c.id } })).body.calculation;
    expect(kept.title).toBe(c.title);
    expect(kept.subsystem).toBe('battery');
  });
});

describe('DELETE /api/calculations/{id}', () => {
  it('lets its author delete it: 204, then 404, gone from the list and search, and audited', async () => {
    const c = await save('member', 'Zanzibarite cable check to delete');
    const found = async () =>
      (await call(search, 'GET', { session: s.member, query: { q: 'zanzibarite' } })).body.hits.length;
    expect(await found()).toBe(1);
    expect((await remove('alumni', c.id)).status).toBe(403);
    expect((await remove('advisor', c.id)).status).toBe(403);
    const res = await remove('member', c.id);
    expect(res.status).toBe(204);
    expect((await call(calculationRoute, 'GET', { session: s.member, params: { id: c.id } })).status).toBe(404);
    const list = await call(calculationsRoute, 'GET', { session: s.member, query: { kind: 'cable', limit: '100' } });
    expect(list.body.calculations.map((x: { id: string }) => x.id)).not.toContain(c.id);
    expect(await found()).toBe(0);
    expect((await remove('member', c.id)).status).toBe(404);
    const entries = (await call(audit, 'GET', { session: s.lead, query: { limit: '20' } })).body.entries;
    expect(JSON.stringify(entries)).toContain('calculation.delete');
  });

  it('409 for edit and delete while an accepted decision record links it; a draft link does not block', async () => {
    const c = await save();
    const rec = await call(recordsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'decision',
        title: 'Main cable section',
        subsystem: 'battery',
        body: templateFor('decision'),
        calculationIds: [c.id],
      },
    });
    expect(rec.status).toBe(201);
    const id = rec.body.record.id;
    expect((await patch('member', c.id, { notes: 'Still a draft decision.' })).status).toBe(200);
    for (const next of ['proposed', 'accepted'])
      expect(
        (await call(status, 'POST', { session: s.lead, params: { id }, body: { status: next } })).status,
        next,
      ).toBe(200);
    const edit = await patch('lead', c.id, { title: 'Changed under an accepted decision' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe('conflict');
    expect(edit.body.error.message).toContain('Main cable section');
    expect((await remove('member', c.id)).status).toBe(409);
    expect((await remove('lead', c.id)).status).toBe(409);
    expect((await call(calculationRoute, 'GET', { session: s.member, params: { id: c.id } })).status).toBe(200);
  });
});

describe('search snippets for calculations', () => {
  it('show labels and values in words, never field keys', async () => {
    const res = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'propeller',
        title: 'Quillwort propeller check',
        subsystem: 'propulsion',
        notes: '',
        inputs: { blades: 3, bladeAreaRatio: 0.55, pitchRatio: 1.0, diameter_m: 0.2, rpm: 1200, speed_mps: 2.5 },
      },
    });
    expect(res.status).toBe(201);
    const hits = (await call(search, 'GET', { session: s.member, query: { q: 'quillwort' } })).body.hits as {
      snippet: string;
    }[];
    expect(hits).toHaveLength(1);
    expect(hits[0].snippet).toMatch(/^Blades 3, /);
    expect(hits[0].snippet).toContain('pitch ratio 1');
    expect(hits[0].snippet).not.toMatch(/pitchRatio|diameter_m|speed_mps|bladeAreaRatio/);
    // Demo calculations too: every calculation hit for a broad word is free of field keys.
    const broad = (await call(search, 'GET', { session: s.member, query: { q: 'propeller', type: 'calculation' } }))
      .body.hits as { snippet: string }[];
    expect(broad.length).toBeGreaterThan(0);
    for (const h of broad) expect(h.snippet).not.toMatch(/\b[a-z]+[A-Z][A-Za-z]*\b|\w+_(m|mps|C|W)\b/);
  });
});
