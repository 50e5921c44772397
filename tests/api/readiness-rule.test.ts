import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as subsystems from '../../src/pages/api/subsystems/index';
import * as subsystem from '../../src/pages/api/subsystems/[slug]';
import * as readiness from '../../src/pages/api/readiness';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type Check = { key: string; label: string; missing: string[] };
const decisionsCheck = async (slug: string): Promise<Check> =>
  (await call(readiness, 'GET', { session: s.member })).body.subsystems
    .find((x: { slug: string }) => x.slug === slug)
    .checks.find((c: Check) => c.key === 'decisions');

describe('readiness: "every accepted decision links a calculation" only where a calculator applies', () => {
  it('the demo seeds steering and telemetry without calculators, the rest with', async () => {
    const list = (await call(subsystems, 'GET', { session: s.member })).body.subsystems as {
      slug: string;
      calculationsApply: boolean;
    }[];
    expect(Object.fromEntries(list.map((x) => [x.slug, x.calculationsApply]))).toMatchObject({
      steering: false,
      telemetry: false,
      propulsion: true,
      hull: true,
      battery: true,
    });
    expect((await decisionsCheck('steering')).label).toMatch(/no calculator applies/);
    expect((await decisionsCheck('propulsion')).label).toMatch(/linked calculation/);
  });

  it('a lead switches it; readiness stops (and starts again) asking for linked calculations', async () => {
    const before = await decisionsCheck('cooling');
    expect(before.label).toMatch(/linked calculation/);
    const off = await call(subsystem, 'PATCH', {
      session: s.lead,
      params: { slug: 'cooling' },
      body: { calculationsApply: false },
    });
    expect(off.status).toBe(200);
    const after = await decisionsCheck('cooling');
    expect(after.label).toMatch(/no calculator applies/);
    expect(after.missing.some((m) => m.includes('linked calculation'))).toBe(false);
    await call(subsystem, 'PATCH', { session: s.lead, params: { slug: 'cooling' }, body: { calculationsApply: true } });
    expect((await decisionsCheck('cooling')).label).toMatch(/linked calculation/);
  });

  it('only leads change it (403), and only to a boolean (400)', async () => {
    for (const role of ['advisor', 'member', 'alumni'] as const)
      expect(
        (
          await call(subsystem, 'PATCH', {
            session: s[role],
            params: { slug: 'cooling' },
            body: { calculationsApply: false },
          })
        ).status,
      ).toBe(403);
    const bad = await call(subsystem, 'PATCH', {
      session: s.lead,
      params: { slug: 'cooling' },
      body: { calculationsApply: 'no' },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('calculationsApply');
  });
});
