import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as seasons from '../../src/pages/api/seasons/index';
import * as season from '../../src/pages/api/seasons/[id]/index';
import * as rollover from '../../src/pages/api/seasons/[id]/rollover';
import * as people from '../../src/pages/api/people/index';
import * as subsystems from '../../src/pages/api/subsystems/index';
import * as subsystem from '../../src/pages/api/subsystems/[slug]';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const next = { name: '2026–27', startsOn: '2026-12-19', endsOn: '2027-12-17', phase: 'design', boat: 'Tern 6' };

describe('seasons', () => {
  let newId = '';
  it('a lead opens a season; it is not current until made so', async () => {
    const res = await call(seasons, 'POST', { session: s.lead, body: next });
    expect(res.status).toBe(201);
    expect(res.body.season).toMatchObject({ name: '2026–27', phase: 'design', current: false, boat: 'Tern 6' });
    newId = res.body.season.id;
  });

  it('409 for a duplicate name, 400 for an end before the start, 403 for others', async () => {
    expect((await call(seasons, 'POST', { session: s.lead, body: next })).status).toBe(409);
    const bad = await call(seasons, 'POST', {
      session: s.lead,
      body: { ...next, name: '2027–28', endsOn: '2026-01-01' },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('endsOn');
    for (const role of ['advisor', 'member', 'alumni'] as const)
      expect((await call(seasons, 'POST', { session: s[role], body: { ...next, name: `x-${role}` } })).status).toBe(
        403,
      );
  });

  it('moves a phase; 400 for an unknown phase', async () => {
    const res = await call(season, 'PATCH', { session: s.lead, params: { id: newId }, body: { phase: 'build' } });
    expect(res.body.season.phase).toBe('build');
    expect(
      (await call(season, 'PATCH', { session: s.lead, params: { id: newId }, body: { phase: 'party' } })).status,
    ).toBe(400);
    expect(
      (await call(season, 'PATCH', { session: s.lead, params: { id: 'nope' }, body: { phase: 'build' } })).status,
    ).toBe(404);
  });

  it('rollover refuses a season that does not start after the current one (409), and writes nothing', async () => {
    const all = (await call(seasons, 'GET', { session: s.lead })).body.seasons;
    const earlier = all.find((x: { name: string }) => x.name === '2024–25');
    const res = await call(rollover, 'POST', {
      session: s.lead,
      params: { id: earlier.id },
      body: { continuing: [], confirm: true },
    });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.message).toMatch(/later season/);
    const still = (await call(seasons, 'GET', { session: s.lead })).body.seasons.find(
      (x: { current: boolean }) => x.current,
    );
    expect(still.name).toBe('2025–26');
    const people2 = (await call(people, 'GET', { session: s.lead })).body.people;
    expect(people2.find((p: { name: string }) => p.name === 'Hanna Voss').role).toBe('member');
  });

  it('rollover without a list keeps every member of the current season, with subsystem names', async () => {
    const preview = await call(rollover, 'POST', { session: s.lead, params: { id: newId }, body: {} });
    expect(preview.status).toBe(200);
    const changes = preview.body.changes as { name: string; change: string; subsystemNames: string[] }[];
    expect(changes.length).toBeGreaterThan(0);
    expect(changes.every((c) => c.change === 'continues')).toBe(true);
    const jonas = changes.find((c) => c.name === 'Jonas Lindqvist')!;
    expect([...jonas.subsystemNames].sort()).toEqual(['Cooling', 'Propulsion and motor drive']);
  });

  it('rollover previews exactly what will change, and only writes with confirm', async () => {
    const members = (await call(people, 'GET', { session: s.lead })).body.people;
    const jonas = members.find((p: { name: string }) => p.name === 'Jonas Lindqvist');
    const preview = await call(rollover, 'POST', {
      session: s.lead,
      params: { id: newId },
      body: { continuing: [jonas.id] },
    });
    expect(preview.status).toBe(200);
    expect(preview.body.applied).toBe(false);
    expect(preview.body.from).toBe('2025–26');
    const changes = preview.body.changes;
    expect(changes.find((c: { userId: string }) => c.userId === jonas.id).change).toBe('continues');
    expect(changes.filter((c: { change: string }) => c.change === 'to-alumni').length).toBeGreaterThan(0);
    const unchanged = (await call(seasons, 'GET', { session: s.lead })).body.seasons.find(
      (x: { current: boolean }) => x.current,
    );
    expect(unchanged.name).toBe('2025–26');

    expect(
      (await call(rollover, 'POST', { session: s.member, params: { id: newId }, body: { confirm: true } })).status,
    ).toBe(403);
    expect(
      (await call(rollover, 'POST', { session: s.lead, params: { id: newId }, body: { continuing: ['stranger'] } }))
        .status,
    ).toBe(400);

    const done = await call(rollover, 'POST', {
      session: s.lead,
      params: { id: newId },
      body: { continuing: [jonas.id], confirm: true },
    });
    expect(done.body.applied).toBe(true);
    const now = (await call(seasons, 'GET', { session: s.lead })).body.seasons;
    expect(now.filter((x: { current: boolean }) => x.current).map((x: { name: string }) => x.name)).toEqual([
      '2026–27',
    ]);
    const after = (await call(people, 'GET', { session: s.lead })).body.people;
    const hanna = after.find((p: { name: string }) => p.name === 'Hanna Voss');
    expect(hanna.role).toBe('alumni');
    const j = after.find((p: { id: string }) => p.id === jonas.id);
    expect(j.role).toBe('member');
    expect(j.seasons[0]).toMatchObject({ season: '2026–27', role: 'member' });
    expect(j.seasons[0].subsystems.map((x: { slug: string }) => x.slug)).toEqual(['propulsion', 'cooling']);
  });
});

describe('subsystems', () => {
  it('a lead adds and renames a subsystem; duplicates 409; others 403', async () => {
    const add = await call(subsystems, 'POST', {
      session: s.lead,
      body: { slug: 'foils', name: 'Foils', summary: 'Hydrofoils and their control.' },
    });
    expect(add.status).toBe(201);
    expect(
      (await call(subsystems, 'POST', { session: s.lead, body: { slug: 'foils', name: 'Foils again' } })).status,
    ).toBe(409);
    expect((await call(subsystems, 'POST', { session: s.member, body: { slug: 'x', name: 'X' } })).status).toBe(403);
    const ren = await call(subsystem, 'PATCH', {
      session: s.lead,
      params: { slug: 'foils' },
      body: { name: 'Hydrofoils' },
    });
    expect(ren.body.subsystem.name).toBe('Hydrofoils');
    expect(
      (await call(subsystem, 'PATCH', { session: s.lead, params: { slug: 'nope' }, body: { name: 'X' } })).status,
    ).toBe(404);
  });
});
