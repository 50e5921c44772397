import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionFor } from '../setup/db';
import * as seasons from '../../src/pages/api/seasons/index';
import * as subsystems from '../../src/pages/api/subsystems/index';
import { seedDemoIfEmpty } from '../../src/lib/server/demo/seed';

beforeAll(seedDemo);

describe('GET /api/seasons and /api/subsystems', () => {
  it('401 when signed out', async () => {
    expect((await call(seasons, 'GET')).status).toBe(401);
    expect((await call(subsystems, 'GET')).status).toBe(401);
  });

  it('lists the demo seasons newest first with exactly one current', async () => {
    const res = await call(seasons, 'GET', { session: await sessionFor('alumni') });
    expect(res.status).toBe(200);
    const list = res.body.seasons;
    expect(list.length).toBeGreaterThanOrEqual(3);
    expect(list.filter((s: { current: boolean }) => s.current)).toHaveLength(1);
    for (const s of list)
      expect(Object.keys(s).sort()).toEqual(['boat', 'current', 'endsOn', 'id', 'name', 'phase', 'startsOn']);
    const starts = list.map((s: { startsOn: string }) => s.startsOn);
    expect([...starts].sort().reverse()).toEqual(starts);
  });

  it('lists the subsystems with slug, name, summary and whether calculators apply', async () => {
    const res = await call(subsystems, 'GET', { session: await sessionFor('member') });
    expect(res.status).toBe(200);
    expect(res.body.subsystems.length).toBeGreaterThanOrEqual(6);
    expect(res.body.subsystems[0]).toEqual({
      slug: expect.any(String),
      name: expect.any(String),
      summary: expect.any(String),
      calculationsApply: expect.any(Boolean),
    });
  });

  it('seeding twice changes nothing', async () => {
    const before = (await call(seasons, 'GET', { session: await sessionFor('lead') })).body.seasons;
    expect(await seedDemoIfEmpty()).toBe(false);
    const after = (await call(seasons, 'GET', { session: await sessionFor('lead') })).body.seasons;
    expect(after).toEqual(before);
  });
});
