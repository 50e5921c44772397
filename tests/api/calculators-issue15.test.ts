// Issue 15 sections 3, 4, 6 and 7: the new kinds and fields in GET /api/calculators, and the form-factor fit route.
import { beforeAll, describe, expect, it } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as calculatorsRoute from '../../src/pages/api/calculators/index';
import * as run from '../../src/pages/api/calculators/[kind]/run';
import * as fit from '../../src/pages/api/calculators/resistance/fit';
import { runCalculator } from '../../src/lib/calc';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type Meta = { name: string; unit: string; min?: number; max?: number; default?: unknown; help: string };
type Described = {
  kind: string;
  inputs: Meta[];
  outputs: { name: string }[];
  sources: { citation: string }[];
  cautions: string[];
};

describe('GET /api/calculators describes the new kinds and fields', () => {
  let list: Described[];
  beforeAll(async () => {
    const res = await call(calculatorsRoute, 'GET', { session: s.member });
    expect(res.status).toBe(200);
    list = res.body.calculators;
  });
  const get = (kind: string) => list.find((c) => c.kind === kind)!;
  const names = (ms: { name: string }[]) => ms.map((m) => m.name);

  it('planing: the issue’s inputs and outputs, Savitsky cited, water and propeller cautions', () => {
    const c = get('planing');
    expect(names(c.inputs)).toEqual(
      expect.arrayContaining([
        'mass_kg',
        'beam_m',
        'lcg_m',
        'deadrise_deg',
        'speed_mps',
        'temperature_C',
        'water',
        'appendageDragArea_m2',
      ]),
    );
    expect(c.inputs.find((i) => i.name === 'appendageDragArea_m2')!.default).toBe(0);
    expect(names(c.outputs)).toEqual([
      'trim_deg',
      'meanWettedLengthBeamRatio',
      'speedCoefficient',
      'liftCoefficient',
      'resistance_N',
      'effectivePower_W',
    ]);
    expect(c.sources.map((x) => x.citation).join(' ')).toMatch(/Savitsky \(1964\).*Marine Technology/);
    expect(c.cautions.join(' ')).toMatch(/safety boat/);
    expect(c.cautions.join(' ')).toMatch(/propeller/);
  });
  it('foil: the issue’s inputs with their defaults and outputs, Helmbold cited, foil caution', () => {
    const c = get('foil');
    const def = (n: string) => c.inputs.find((i) => i.name === n)!.default;
    expect(def('zeroLiftAngle_deg')).toBe(-2);
    expect(def('sectionDragCoefficient')).toBe(0.008);
    expect(def('spanEfficiency')).toBe(0.9);
    expect(names(c.inputs)).toEqual(
      expect.arrayContaining([
        'area_m2',
        'aspectRatio',
        'angleOfAttack_deg',
        'speed_mps',
        'mass_kg',
        'temperature_C',
        'water',
      ]),
    );
    expect(names(c.outputs)).toEqual(
      expect.arrayContaining([
        'liftCoefficient',
        'lift_N',
        'inducedDrag_N',
        'drag_N',
        'liftToDrag',
        'takeOffSpeed_mps',
      ]),
    );
    expect(c.sources.map((x) => x.citation).join(' ')).toMatch(/Helmbold \(1942\)/);
    expect(c.cautions.join(' ')).toMatch(/Foils have sharp edges/);
  });
  it('resistance keeps its outputs and adds froude', () => {
    expect(names(get('resistance').outputs)).toEqual([
      'reynolds',
      'cf',
      'frictionalResistance_N',
      'appendageResistance_N',
      'totalResistance_N',
      'effectivePower_W',
      'froude',
    ]);
  });
  it('cable: conductor (stranded default | solid), IEC 60228 named', () => {
    const c = get('cable');
    const conductor = c.inputs.find((i) => i.name === 'conductor') as Meta & { options: { value: string }[] };
    expect(conductor.default).toBe('stranded');
    expect(conductor.options.map((o) => o.value)).toEqual(['stranded', 'solid']);
    expect(c.sources[0].citation).toMatch(/IEC 60228:2004.*Table 1.*Table 2/);
  });
  it('cooling: glycolFraction 0–0.6, glycol50 still a choice, Melinder named', () => {
    const c = get('cooling');
    const g = c.inputs.find((i) => i.name === 'glycolFraction')!;
    expect([g.min, g.max]).toEqual([0, 0.6]);
    const coolant = c.inputs.find((i) => i.name === 'coolant') as Meta & { options: { value: string }[] };
    expect(coolant.options.map((o) => o.value)).toEqual(['water', 'glycol', 'glycol50']);
    expect(c.sources.map((x) => x.citation).join(' ')).toMatch(/Melinder/);
  });
  it('solar: windSpeed_mps, cellTemperatureModel (noct default | faiman), faimanU0 25, faimanU1 6.84', () => {
    const c = get('solar');
    const def = (n: string) => c.inputs.find((i) => i.name === n)!.default;
    expect(def('cellTemperatureModel')).toBe('noct');
    expect(def('faimanU0')).toBe(25);
    expect(def('faimanU1')).toBe(6.84);
    expect(names(c.inputs)).toContain('windSpeed_mps');
    expect(c.sources.map((x) => x.citation).join(' ')).toMatch(/Faiman \(2008\).*Progress in Photovoltaics/);
  });
});

describe('POST /api/calculators/{planing|foil}/run', () => {
  it('planing runs with its defaults and refuses a non-planing speed with 422', async () => {
    const ok = await call(run, 'POST', { session: s.member, params: { kind: 'planing' }, body: { inputs: {} } });
    expect(ok.status).toBe(200);
    expect(ok.body.outputs.trim_deg).toBeGreaterThan(2);
    expect(ok.body.series.resistance.x.values.length).toBeGreaterThan(20);
    const slow = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'planing' },
      body: { inputs: { speed_mps: 1 } },
    });
    expect(slow.status).toBe(422);
    expect(slow.body.error.code).toBe('out_of_range');
  });
  it('foil: a bad field is a 400 naming it', async () => {
    const bad = await call(run, 'POST', {
      session: s.member,
      params: { kind: 'foil' },
      body: { inputs: { aspectRatio: -1 } },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toContain('inputs.aspectRatio');
  });
});

describe('POST /api/calculators/resistance/fit', () => {
  const hull = { length_m: 5.5, wettedArea_m2: 3, appendageDragArea_m2: 0.004, temperature_C: 18, water: 'fresh' };
  // Synthetic log made by the engine itself: electrical power = effective power / η at a known form factor.
  const synthetic = (formFactor: number, eta: number, noise: (i: number) => number = () => 0) =>
    [2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6].map((v, i) => {
      const r = runCalculator('resistance', { ...hull, formFactor, speed_mps: v });
      if (!r.ok) throw new Error(JSON.stringify(r));
      return { speed_mps: v, power_W: (r.result.outputs.effectivePower_W as number) / eta + noise(i) };
    });

  it('recovers a known form factor (1.17) from the engine’s own points, R² = 1, residuals ≈ 0', async () => {
    const res = await call(fit, 'POST', {
      session: s.member,
      body: { inputs: { ...hull, formFactor: 1 }, points: synthetic(1.17, 0.62), drivetrainEfficiency: 0.62 },
    });
    expect(res.status).toBe(200);
    expect(res.body.formFactor).toBeCloseTo(1.17, 10);
    expect(res.body.rSquared).toBeCloseTo(1, 12);
    expect(res.body.residuals).toHaveLength(9);
    for (const r of res.body.residuals) expect(Math.abs(r.residual_W)).toBeLessThan(1e-9);
    expect(res.body.inputs).toMatchObject({ ...hull, formFactor: 1.17 });
    expect(res.body.warnings).toEqual([]);
  });
  it('with scattered points the fit stays near the truth and R² drops below 1', async () => {
    const res = await call(fit, 'POST', {
      session: s.member,
      body: {
        inputs: hull,
        points: synthetic(1.1, 0.7, (i) => (i % 2 ? 25 : -25)),
        drivetrainEfficiency: 0.7,
      },
    });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.formFactor - 1.1)).toBeLessThan(0.02);
    expect(res.body.rSquared).toBeLessThan(1);
    expect(res.body.rSquared).toBeGreaterThan(0.95);
  });
  it('a form factor outside 1–2 is reported with a warning and no inputs to save', async () => {
    const res = await call(fit, 'POST', {
      session: s.member,
      body: { inputs: hull, points: synthetic(1.1, 0.3), drivetrainEfficiency: 0.9 },
    });
    expect(res.status).toBe(200);
    expect(res.body.formFactor).toBeGreaterThan(2);
    expect(res.body.inputs).toBeNull();
    expect(res.body.warnings.join(' ')).toMatch(/outside 1–2/);
  });
  it('400 on bad points, each named by its path', async () => {
    const post = (body: unknown) => call(fit, 'POST', { session: s.member, body });
    const few = await post({ inputs: hull, points: [{ speed_mps: 3, power_W: 500 }], drivetrainEfficiency: 0.7 });
    expect(few.status).toBe(400);
    expect(few.body.error.issues[0].path).toBe('points');
    const neg = await post({
      inputs: hull,
      points: [
        { speed_mps: 3, power_W: 500 },
        { speed_mps: -1, power_W: 600 },
        { speed_mps: 4, power_W: 'lots' },
      ],
      drivetrainEfficiency: 0.7,
    });
    expect(neg.status).toBe(400);
    expect(neg.body.error.issues.map((i: { path: string }) => i.path)).toEqual(
      expect.arrayContaining(['points.1.speed_mps', 'points.2.power_W']),
    );
    const eta = await post({ inputs: hull, points: synthetic(1.1, 0.7), drivetrainEfficiency: 1.5 });
    expect(eta.status).toBe(400);
    expect(eta.body.error.issues[0].path).toBe('drivetrainEfficiency');
    const same = await post({
      inputs: hull,
      points: [3, 3, 3].map((v) => ({ speed_mps: v, power_W: 400 })),
      drivetrainEfficiency: 0.7,
    });
    expect(same.status).toBe(400);
    const slow = await post({
      inputs: hull,
      points: [{ speed_mps: 0.01, power_W: 1 }, ...synthetic(1.1, 0.7)],
      drivetrainEfficiency: 0.7,
    });
    expect(slow.status).toBe(400);
    expect(slow.body.error.issues[0].path).toBe('points.0.speed_mps');
    const badHull = await post({ inputs: { length_m: -2 }, points: synthetic(1.1, 0.7), drivetrainEfficiency: 0.7 });
    expect(badHull.status).toBe(400);
    expect(badHull.body.error.issues[0].path).toBe('inputs.length_m');
  });
  it('401 signed out', async () => {
    expect((await call(fit, 'POST', { body: {} })).status).toBe(401);
  });
});
