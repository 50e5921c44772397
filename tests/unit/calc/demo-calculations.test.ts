import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { calculators, runCalculator } from '../../../src/lib/calc';

// The demo scenario's saved calculations (invented numbers for the fictional team) must all compute.
const root = join(__dirname, '..', '..', '..');
const calcs = JSON.parse(readFileSync(join(root, 'content/demo/calculations.json'), 'utf8')) as {
  id: string;
  kind: string;
  title: string;
  subsystem: string;
  season: string;
  author: string;
  createdAt: string;
  notes: string;
  inputs: Record<string, unknown>;
}[];
const team = JSON.parse(readFileSync(join(root, 'content/demo/team.json'), 'utf8')) as {
  seasons: { name: string; startsOn: string; endsOn: string }[];
  subsystems: { slug: string }[];
  people: { email: string }[];
};

const EXPECTED: [string, string, string, string][] = [
  ['demo-calc-prop-endurance-2526', 'propeller', 'propulsion', '2025–26'],
  ['demo-calc-prop-sprint-2526', 'propeller', 'propulsion', '2025–26'],
  ['demo-calc-resistance-2526', 'resistance', 'hull', '2025–26'],
  ['demo-calc-energy-endurance-2526', 'energy', 'battery', '2025–26'],
  ['demo-calc-solar-deck-2526', 'solar', 'solar', '2025–26'],
  ['demo-calc-cooling-controller-2526', 'cooling', 'cooling', '2025–26'],
  ['demo-calc-cable-battery-main-2526', 'cable', 'battery', '2025–26'],
  ['demo-calc-race-endurance-2526', 'race', 'propulsion', '2025–26'],
  ['demo-calc-sweep-2526', 'propeller-sweep', 'propulsion', '2025–26'],
  ['demo-calc-prop-endurance-2425', 'propeller', 'propulsion', '2024–25'],
  ['demo-calc-resistance-2425', 'resistance', 'hull', '2024–25'],
  ['demo-calc-cooling-2425', 'cooling', 'cooling', '2024–25'],
  ['demo-calc-water-2425', 'water', 'hull', '2024–25'],
  ['demo-calc-cable-steering-2324', 'cable', 'steering', '2023–24'],
  ['demo-calc-energy-2324', 'energy', 'battery', '2023–24'],
  ['demo-calc-solar-2324', 'solar', 'solar', '2023–24'],
];

const AUTHORS: Record<string, string[]> = {
  '2025–26': [
    'member@wakebook.test',
    'lead@wakebook.test',
    'tomas.ferreira@wakebook.test',
    'hanna.voss@wakebook.test',
    'kwame.mensah@wakebook.test',
  ],
  '2024–25': [
    'alumni@wakebook.test',
    'sofia.marchetti@wakebook.test',
    'amara.nwosu@wakebook.test',
    'erik.dahl@wakebook.test',
  ],
  '2023–24': ['daniel.osei@wakebook.test', 'erik.dahl@wakebook.test'],
};

describe('demo saved calculations', () => {
  it('have exactly the agreed ids, kinds, subsystems and seasons', () => {
    expect(calcs.map((c) => [c.id, c.kind, c.subsystem, c.season])).toEqual(EXPECTED);
  });

  for (const c of calcs) {
    it(`${c.id} is well formed and computes without error`, () => {
      expect(calculators).toHaveProperty(c.kind);
      expect(team.subsystems.map((s) => s.slug)).toContain(c.subsystem);
      expect(team.people.map((p) => p.email)).toContain(c.author);
      expect(AUTHORS[c.season]).toContain(c.author);
      const season = team.seasons.find((s) => s.name === c.season)!;
      const at = Date.parse(c.createdAt);
      expect(at).toBeGreaterThanOrEqual(Date.parse(`${season.startsOn}T00:00:00Z`));
      expect(at).toBeLessThanOrEqual(Date.parse(`${season.endsOn}T23:59:59Z`));
      expect(c.title.length).toBeGreaterThan(5);
      expect(c.notes.length).toBeGreaterThan(20);
      const r = runCalculator(c.kind, c.inputs);
      if (!r.ok) throw new Error(`${c.id}: ${JSON.stringify(r)}`);
      // every input is spelled as the calculator declares it (nothing silently dropped)
      const names = calculators[c.kind as keyof typeof calculators].inputs.map((m) => m.name);
      for (const k of Object.keys(c.inputs)) expect(names, `${c.id}.${k}`).toContain(k);
    });
  }

  it('the 2025–26 sprint and endurance propellers are genuinely different (fine vs coarse pitch)', () => {
    const e = calcs.find((c) => c.id === 'demo-calc-prop-endurance-2526')!.inputs as Record<string, number>;
    const s = calcs.find((c) => c.id === 'demo-calc-prop-sprint-2526')!.inputs as Record<string, number>;
    expect(s.pitchRatio).toBeLessThan(e.pitchRatio - 0.3);
    expect(s.bladeAreaRatio).toBeGreaterThan(e.bladeAreaRatio);
    // at the sprint check speed, with the same shaft power, the sprint propeller pushes harder
    const thrustAt = (p: Record<string, number>, rpm: number) => {
      const r = runCalculator('propeller', { ...p, speed_mps: 2.5, rpm });
      if (!r.ok) throw new Error(JSON.stringify(r));
      return r.result.outputs as Record<string, number>;
    };
    const matchPower = (p: Record<string, number>, power: number) => {
      let lo = 300,
        hi = 6000;
      for (let i = 0; i < 60; i++) {
        const mid = (lo + hi) / 2;
        if (thrustAt(p, mid).shaftPower_W > power) hi = mid;
        else lo = mid;
      }
      return thrustAt(p, lo).thrust_N;
    };
    expect(matchPower(s, 4000)).toBeGreaterThan(matchPower(e, 4000));
  });
});
