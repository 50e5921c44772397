import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as calculatorsRoute from '../../src/pages/api/calculators/index';
import * as run from '../../src/pages/api/calculators/[kind]/run';
import * as calculationsRoute from '../../src/pages/api/calculations/index';
import * as calculationRoute from '../../src/pages/api/calculations/[id]/index';
import * as recompute from '../../src/pages/api/calculations/[id]/recompute';
import * as compare from '../../src/pages/api/calculations/compare';
import * as audit from '../../src/pages/api/audit';
import { calculatorKinds, calculators } from '../../src/lib/calc';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

const propeller = {
  blades: 4,
  bladeAreaRatio: 0.7,
  pitchRatio: 1.0,
  diameter_m: 0.2,
  rpm: 1200,
  speed_mps: 2.0,
  wakeFraction: 0,
  temperature_C: 20,
  water: 'fresh',
};

describe('GET /api/calculators', () => {
  it('401 signed out; lists every kind with inputs, outputs and sources', async () => {
    expect((await call(calculatorsRoute, 'GET')).status).toBe(401);
    const res = await call(calculatorsRoute, 'GET', { session: s.alumni });
    expect(res.status).toBe(200);
    const kinds = res.body.calculators.map((c: { kind: string }) => c.kind);
    expect(kinds).toEqual([...calculatorKinds]);
    for (const c of res.body.calculators) {
      expect(c.inputs.length).toBeGreaterThan(0);
      expect(c.sources.length).toBeGreaterThan(0);
      for (const i of c.inputs) expect(i).toHaveProperty('help');
    }
    const prop = res.body.calculators.find((c: { kind: string }) => c.kind === 'propeller');
    expect(prop.inputs.map((i: { name: string }) => i.name)).toEqual(
      expect.arrayContaining([
        'blades',
        'bladeAreaRatio',
        'pitchRatio',
        'diameter_m',
        'rpm',
        'speed_mps',
        'wakeFraction',
        'temperature_C',
        'water',
      ]),
    );
  });
});

describe('POST /api/calculators/{kind}/run', () => {
  it('computes without saving: the dimensional check of REFERENCES.md §1 (derived, Oosterveld & van Oossanen 1975 polynomial)', async () => {
    const count = async () =>
      (await call(calculationsRoute, 'GET', { session: s.advisor, query: { limit: '100' } })).body.calculations.length;
    const before = await count();
    const res = await call(run, 'POST', {
      session: s.advisor,
      params: { kind: 'propeller' },
      body: { inputs: propeller },
    });
    expect(res.status).toBe(200);
    expect(res.body.outputs.advanceRatio).toBeCloseTo(0.5, 9);
    expect(res.body.outputs.thrust_N).toBeCloseTo(173.1499, 2);
    expect(res.body.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(res.body.series.openWater.x.values.length).toBeGreaterThan(10);
    expect(await count()).toBe(before);
  });

  it('401 signed out, 404 for an unknown kind', async () => {
    expect((await call(run, 'POST', { params: { kind: 'propeller' }, body: { inputs: {} } })).status).toBe(401);
    const res = await call(run, 'POST', { session: s.member, params: { kind: 'warp-drive' }, body: { inputs: {} } });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('400 names the bad input', async () => {
    const res = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'propeller' },
      body: { inputs: { ...propeller, rpm: 'fast' } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('inputs.rpm');
  });

  it('422 out_of_range names the input outside the B-series polynomial (P/D above 1.4)', async () => {
    const res = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'propeller' },
      body: { inputs: { ...propeller, pitchRatio: 1.8 } },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('out_of_range');
    expect(res.body.error.input).toBe('pitchRatio');
    expect(res.body.error.issues[0].path).toBe('pitchRatio');
  });
});

describe('saved calculations', () => {
  let savedId = '';

  it('a member saves one; outputs are computed on the server and any sent outputs are ignored', async () => {
    const res = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'propeller',
        title: 'B4-70 check point',
        subsystem: 'propulsion',
        notes: 'From the reference table.',
        inputs: propeller,
        outputs: { thrust_N: 1 },
      },
    });
    expect(res.status).toBe(201);
    const c = res.body.calculation;
    savedId = c.id;
    expect(c.outputs.thrust_N).toBeCloseTo(173.1499, 2);
    expect(c.season).toBe('2025–26');
    expect(c.results).toHaveLength(1);
    const a = await call(audit, 'GET', { session: s.lead, query: { action: 'calculation.create' } });
    expect(a.body.entries.some((e: { target: string }) => e.target === `calculation:${savedId}`)).toBe(true);
  });

  it.each(['alumni', 'advisor'] as const)('%s may not save (403)', async (role) => {
    const res = await call(calculationsRoute, 'POST', {
      session: s[role],
      body: { kind: 'cable', title: 'Not allowed', subsystem: 'battery', inputs: {} },
    });
    expect(res.status).toBe(403);
  });

  it('400 for a missing title or an unknown subsystem, 404 for an unknown kind, 422 out of range', async () => {
    const missing = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: { kind: 'cable', subsystem: 'battery', inputs: {} },
    });
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues.map((i: { path: string }) => i.path)).toContain('title');
    const badSub = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: { kind: 'cable', title: 'Cable', subsystem: 'rigging', inputs: {} },
    });
    expect(badSub.status).toBe(400);
    expect(badSub.body.error.issues[0].path).toBe('subsystem');
    const badKind = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: { kind: 'teleporter', title: 'Nope', subsystem: 'battery', inputs: {} },
    });
    expect(badKind.status).toBe(404);
    const range = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'propeller',
        title: 'Seven-plus blades',
        subsystem: 'propulsion',
        inputs: { ...propeller, blades: 9 },
      },
    });
    expect(range.status).toBe(422);
    expect(range.body.error.input).toBe('blades');
  });

  it('reads one back (200) and 404 for an unknown id', async () => {
    const res = await call(calculationRoute, 'GET', { session: s.alumni, params: { id: savedId } });
    expect(res.status).toBe(200);
    expect(res.body.calculation.inputs.pitchRatio).toBe(1);
    expect((await call(calculationRoute, 'GET', { session: s.alumni, params: { id: 'nope' } })).status).toBe(404);
  });

  it('recompute keeps the earlier result and reports what changed; alumni may not', async () => {
    expect((await call(recompute, 'POST', { session: s.alumni, params: { id: savedId } })).status).toBe(403);
    const res = await call(recompute, 'POST', { session: s.member, params: { id: savedId } });
    expect(res.status).toBe(200);
    expect(res.body.calculation.results).toHaveLength(2);
    expect(res.body.changes).toEqual([]); // same engine, same inputs: nothing changes
    expect((await call(recompute, 'POST', { session: s.member, params: { id: 'nope' } })).status).toBe(404);
  });

  it('lists the demo calculations, filters by kind and pages with a cursor', async () => {
    const all = await call(calculationsRoute, 'GET', { session: s.member, query: { limit: '100' } });
    expect(all.status).toBe(200);
    expect(all.body.calculations.length).toBeGreaterThanOrEqual(13);
    const props = await call(calculationsRoute, 'GET', { session: s.member, query: { kind: 'propeller' } });
    expect(props.body.calculations.every((c: { kind: string }) => c.kind === 'propeller')).toBe(true);
    // Each item names its calculator the way the pages do, beside the kind key (the record editor's picker shows it).
    const sweep = all.body.calculations.find((c: { kind: string }) => c.kind === 'propeller-sweep');
    expect(sweep.kindTitle).toBe(calculators['propeller-sweep'].title);
    expect(props.body.calculations[0].kindTitle).toBe(calculators.propeller.title);
    const page1 = await call(calculationsRoute, 'GET', { session: s.member, query: { limit: '5' } });
    expect(page1.body.calculations).toHaveLength(5);
    const page2 = await call(calculationsRoute, 'GET', {
      session: s.member,
      query: { limit: '5', cursor: page1.body.nextCursor },
    });
    const ids1 = page1.body.calculations.map((c: { id: string }) => c.id);
    expect(page2.body.calculations.some((c: { id: string }) => ids1.includes(c.id))).toBe(false);
    expect((await call(calculationsRoute, 'GET', { session: s.member, query: { limit: '0' } })).status).toBe(400);
    expect((await call(calculationsRoute, 'GET', { session: s.member, query: { cursor: 'garbage' } })).status).toBe(
      400,
    );
  });

  it('compares the sprint and endurance propellers side by side', async () => {
    const res = await call(compare, 'GET', {
      session: s.alumni,
      query: { a: 'demo-calc-prop-endurance-2526', b: 'demo-calc-prop-sprint-2526' },
    });
    expect(res.status).toBe(200);
    expect(res.body.sameKind).toBe(true);
    const pd = res.body.inputs.find((r: { name: string }) => r.name === 'pitchRatio');
    expect(pd.differs).toBe(true);
    expect(pd.a).toBeGreaterThan(pd.b);
    expect(
      (await call(compare, 'GET', { session: s.alumni, query: { a: 'demo-calc-prop-endurance-2526' } })).status,
    ).toBe(400);
    expect(
      (await call(compare, 'GET', { session: s.alumni, query: { a: 'demo-calc-prop-endurance-2526', b: 'nope' } }))
        .status,
    ).toBe(404);
    expect((await call(compare, 'GET', { query: { a: 'x', b: 'y' } })).status).toBe(401);
  });
});

describe('past seasons (API.md: members create and recompute calculations of the current season only)', () => {
  let pastSeasonId = '';
  let pastCalcId = '';
  beforeAll(async () => {
    const seasonsRoute = await import('../../src/pages/api/seasons/index');
    const seasons = (await call(seasonsRoute, 'GET', { session: s.lead })).body.seasons;
    pastSeasonId = seasons.find((x: { current: boolean }) => !x.current).id;
    const past = await call(calculationsRoute, 'GET', { session: s.lead, query: { season: pastSeasonId } });
    pastCalcId = past.body.calculations[0].id;
  });

  const filing = (seasonId: string) => ({
    kind: 'propeller',
    title: 'Back-dated propeller',
    subsystem: 'propulsion',
    seasonId,
    inputs: propeller,
  });

  it('a member may not file a calculation into a past season (403 forbidden); a lead may', async () => {
    const member = await call(calculationsRoute, 'POST', { session: s.member, body: filing(pastSeasonId) });
    expect(member.status).toBe(403);
    expect(member.body.error.code).toBe('forbidden');
    const lead = await call(calculationsRoute, 'POST', { session: s.lead, body: filing(pastSeasonId) });
    expect(lead.status).toBe(201);
    expect(lead.body.calculation.seasonId).toBe(pastSeasonId);
  });

  it("a member may not recompute a past season's calculation (403 forbidden); a lead may", async () => {
    const member = await call(recompute, 'POST', { session: s.member, params: { id: pastCalcId } });
    expect(member.status).toBe(403);
    expect(member.body.error.code).toBe('forbidden');
    const lead = await call(recompute, 'POST', { session: s.lead, params: { id: pastCalcId } });
    expect(lead.status).toBe(200);
  });
});
