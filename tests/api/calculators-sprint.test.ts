import { beforeAll, describe, expect, it } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as calculatorsRoute from '../../src/pages/api/calculators/index';
import * as run from '../../src/pages/api/calculators/[kind]/run';

// Issue 15 sections 1, 2 and 5 through the HTTP contract: the new kinds and fields are described, sprint runs.
let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type Meta = {
  kind: string;
  inputs: { name: string; unit: string; default?: unknown; help: string }[];
  outputs: { name: string }[];
  sources: { citation: string }[];
};

describe('GET /api/calculators describes issue 15’s kinds and fields', () => {
  it('sprint and battery with their inputs, outputs and sources; envelope and cavitation fields on the old kinds', async () => {
    const res = await call(calculatorsRoute, 'GET', { session: s.member });
    expect(res.status).toBe(200);
    const byKind = new Map<string, Meta>(res.body.calculators.map((c: Meta) => [c.kind, c]));
    const names = (kind: string, what: 'inputs' | 'outputs') => byKind.get(kind)![what].map((i) => i.name);

    expect(names('sprint', 'inputs')).toEqual(
      expect.arrayContaining([
        'mass_kg',
        'distance_m',
        'maxShaftPower_W',
        'maxRpm',
        'maxTorque_Nm',
        'shaftDepth_m',
        'kellerK',
        'pitchRatio',
        'length_m',
        'water',
      ]),
    );
    expect(byKind.get('sprint')!.inputs.find((i) => i.name === 'distance_m')!.default).toBe(200);
    expect(names('sprint', 'outputs')).toEqual(
      expect.arrayContaining([
        'time_s',
        'topSpeed_mps',
        'distanceTo90pct_m',
        'cavitationNumber',
        'thrustLoadingCoefficient',
        'burrillLimit',
        'kellerMinBladeAreaRatio',
      ]),
    );
    expect(names('battery', 'inputs')).toEqual(
      expect.arrayContaining([
        'cellsSeries',
        'cellsParallel',
        'cellCapacity_Ah',
        'cellNominal_V',
        'cellResistance_ohm',
        'cellMaxContinuous_A',
        'power_W',
        'current_A',
      ]),
    );
    expect(names('battery', 'outputs')).toEqual(
      expect.arrayContaining([
        'packNominal_V',
        'packEnergy_Wh',
        'packResistance_ohm',
        'current_A',
        'loadVoltage_V',
        'heat_W',
        'cRate',
        'runtime_h',
      ]),
    );
    for (const kind of ['race', 'propeller-sweep'])
      expect(names(kind, 'inputs')).toEqual(
        expect.arrayContaining(['maxShaftPower_W', 'maxRpm', 'maxTorque_Nm', 'shaftDepth_m']),
      );
    expect(names('race', 'outputs')).toEqual(expect.arrayContaining(['limitedBy', 'speed_mps', 'cavitationNumber']));
    expect(names('propeller', 'inputs')).toEqual(expect.arrayContaining(['shaftDepth_m', 'kellerK', 'rpm']));
    expect(names('propeller', 'outputs')).toEqual(expect.arrayContaining(['kellerMinBladeAreaRatio', 'thrust_N']));
    expect(names('propeller-sweep', 'outputs')).toEqual(
      expect.arrayContaining(['sprintBest', 'enduranceBest', 'bestSprintPitchRatio', 'bestEnduranceSpeed_mps']),
    );
    expect(names('energy', 'inputs')).toContain('maxCRate');
    for (const kind of ['sprint', 'propeller', 'race'])
      expect(byKind.get(kind)!.sources.some((x) => x.citation.includes('Burrill'))).toBe(true);
    expect(byKind.get('sprint')!.inputs.find((i) => i.name === 'maxTorque_Nm')!.unit).toBe('N·m');
  });
});

describe('POST /api/calculators/sprint/run', () => {
  it('200 with the time, top speed, series and engine version', async () => {
    const res = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'sprint' },
      body: { inputs: { pitchRatio: 1.2, mass_kg: 240, distance_m: 150 } },
    });
    expect(res.status).toBe(200);
    expect(res.body.outputs.time_s).toBeGreaterThan(5);
    expect(res.body.outputs.topSpeed_mps).toBeGreaterThan(res.body.outputs.averageSpeed_mps);
    expect(['power', 'rpm', 'torque']).toContain(res.body.outputs.limitedBy);
    expect(res.body.series.run.x.values.length).toBeGreaterThan(10);
    expect(res.body.engineVersion).toBe('1.0.0');
  });

  it('400 names the bad input (text for a number, a negative distance)', async () => {
    const res = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'sprint' },
      body: { inputs: { mass_kg: 'heavy', distance_m: -5 } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['inputs.mass_kg', 'inputs.distance_m']));
  });

  it('422 out_of_range for a pitch ratio outside the B-series', async () => {
    const res = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'sprint' },
      body: { inputs: { pitchRatio: 2 } },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('out_of_range');
    expect(res.body.error.input).toBe('pitchRatio');
  });

  it('battery runs; 401 signed out', async () => {
    const ok = await call(run, 'POST', {
      session: s.alumni,
      params: { kind: 'battery' },
      body: { inputs: { current_A: 50 } },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.outputs.current_A).toBe(50);
    expect((await call(run, 'POST', { params: { kind: 'sprint' }, body: { inputs: {} } })).status).toBe(401);
  });
});
