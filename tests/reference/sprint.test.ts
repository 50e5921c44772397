import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { integrateStandingStart, sprintContext, thrustAt } from '../../src/lib/calc/sprint';
import { calculators } from '../../src/lib/calc';

// Sprint from a standing start: m·dv/dt = T(v)·(1 − t) − R(v) inside the motor's envelope.
// Integrator check: the closed form for constant thrust and quadratic drag (J.R. Taylor (2005), "Classical
// Mechanics", University Science Books, §2.4): v(t) = v_t·tanh(t/τ), x(t) = v_t·τ·ln cosh(t/τ), v_t = √(T/k),
// τ = m/√(kT). Reference numbers computed independently in Python from those formulas (derived).
// Propeller and hull: B-series (Oosterveld & van Oossanen 1975, Table 5) and ITTC-1957 (REFERENCES.md §1–2).

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('standing-start integration against the quadratic-drag closed form (Taylor 2005, §2.4; derived)', () => {
  // m 250 kg, T 600 N, R = 4·v² N: v_t 12.2474 m/s, τ 5.10310 s
  const m = 250;
  const T = 600;
  const k = 4;
  const vt = Math.sqrt(T / k);
  const run = integrateStandingStart((v) => (T - k * v * v) / m, vt, 200);

  it('time over 200 m = τ·acosh(exp(d/(v_t·τ))) = 19.865012 s (relative 1e-5)', () => {
    expect(rel(run.time_s, 19.86501241559098)).toBeLessThan(1e-5);
  });

  it('90 % of top speed at t = τ·atanh 0.9 = 7.512889 s, x = v_t·τ·½·ln(1/0.19) = 51.897850 m (relative 1e-5)', () => {
    expect(rel(run.timeTo90pct_s, 7.512888622624135)).toBeLessThan(1e-5);
    expect(rel(run.distanceTo90pct_m, 51.897850213176596)).toBeLessThan(1e-5);
  });

  it('every recorded point lies on v_t·tanh(t/τ) (relative 1e-4; the first, steepest steps carry the largest error)', () => {
    const tau = m / Math.sqrt(k * T);
    run.t.forEach((t, i) => {
      if (t > 0 && t <= run.time_s) expect(rel(run.v[i], vt * Math.tanh(t / tau))).toBeLessThan(1e-4);
    });
  });
});

const BOAT = {
  length_m: 5.5,
  wettedArea_m2: 3,
  formFactor: 1.1,
  appendageDragArea_m2: 0.002,
  temperature_C: 20,
  water: 'fresh',
  mass_kg: 260,
  distance_m: 200,
  blades: 3,
  bladeAreaRatio: 0.5,
  pitchRatio: 1.2,
  diameter_m: 0.2,
  wakeFraction: 0.03,
  thrustDeduction: 0.02,
  maxShaftPower_W: 6000,
  maxRpm: 3000,
  maxTorque_Nm: 20,
  shaftDepth_m: 0.3,
  kellerK: 0.2,
};

function sprint(over: object = {}) {
  const r = runCalculator('sprint', { ...BOAT, ...over });
  if (!r.ok) throw new Error(JSON.stringify(r));
  return { o: r.result.outputs as Record<string, number>, result: r.result };
}

describe('sprint (physical sanity)', () => {
  it('at top speed T·(1 − t) = R, and the envelope holds at every speed of the force chart', () => {
    const { o, result } = sprint();
    const input = calculators.sprint.inputSchema.parse({ ...BOAT }) as Parameters<typeof sprintContext>[0];
    const ctx = sprintContext(input);
    const top = thrustAt(ctx, o.topSpeed_mps);
    expect(rel(top.thrust * (1 - BOAT.thrustDeduction), top.resistance)).toBeLessThan(1e-8);
    expect(o.topSpeedRpm).toBeLessThanOrEqual(BOAT.maxRpm * (1 + 1e-12));
    for (const v of result.series!.forces.x.values) {
      const f = thrustAt(ctx, v);
      const n = f.n;
      const J = (v * (1 - BOAT.wakeFraction)) / (n * BOAT.diameter_m);
      const r = ctx.race;
      const kq = r.prop.kq[0] + J * (r.prop.kq[1] + J * (r.prop.kq[2] + J * r.prop.kq[3]));
      const torque = kq * r.rho * n * n * BOAT.diameter_m ** 5;
      expect(n * 60).toBeLessThanOrEqual(BOAT.maxRpm * (1 + 1e-9));
      expect(torque).toBeLessThanOrEqual(BOAT.maxTorque_Nm * (1 + 1e-9));
      expect(2 * Math.PI * n * torque).toBeLessThanOrEqual(BOAT.maxShaftPower_W * (1 + 1e-9));
    }
  });

  it('the time falls as power rises, rises with mass and with distance', () => {
    const times = [2000, 3000, 4500, 6000, 9000].map(
      (p) => sprint({ maxShaftPower_W: p, maxTorque_Nm: 1000, maxRpm: 20000 }).o.time_s,
    );
    for (let i = 1; i < times.length; i++) expect(times[i]).toBeLessThan(times[i - 1]);
    expect(sprint({ mass_kg: 400 }).o.time_s).toBeGreaterThan(sprint().o.time_s);
    expect(sprint({ distance_m: 300 }).o.time_s).toBeGreaterThan(sprint().o.time_s);
  });

  it('the speed series rises to the top speed; the distance series ends at the finish at the sprint time', () => {
    const { o, result } = sprint();
    const run = result.series!.run;
    const v = run.y[0].values;
    const x = run.y[1].values;
    for (let i = 1; i < v.length; i++) expect(v[i]).toBeGreaterThanOrEqual(v[i - 1]);
    expect(v[v.length - 1]).toBeLessThanOrEqual(o.topSpeed_mps * (1 + 1e-9));
    expect(run.x.values[run.x.values.length - 1]).toBeCloseTo(o.time_s, 9);
    expect(x[x.length - 1]).toBeCloseTo(BOAT.distance_m, 9);
    for (const d of x) expect(d).toBeLessThanOrEqual(BOAT.distance_m + 1e-9);
    expect(o.averageSpeed_mps).toBeCloseTo(BOAT.distance_m / o.time_s, 12);
    expect(o.distanceTo90pct_m).toBeGreaterThan(0);
  });

  it('limitedBy says which limit sets the top-speed rpm', () => {
    expect(sprint({ maxRpm: 1500, maxTorque_Nm: 1000, maxShaftPower_W: 1e5 }).o.limitedBy).toBe('rpm');
    expect(sprint({ maxRpm: 6000, maxTorque_Nm: 1000, maxShaftPower_W: 3000 }).o.limitedBy).toBe('power');
    expect(sprint({ maxRpm: 6000, maxTorque_Nm: 5, maxShaftPower_W: 1e5 }).o.limitedBy).toBe('torque');
  });

  // Cross-check against the figures quoted in issue 15 (sweep defaults: 3 blades, D 0.20 m, 6 kW, 3,000 rpm, hull
  // 5.5 m / 3 m², fresh water 20 °C), computed there independently of this engine: P/D 0.7, A_E/A_0 0.35 reaches
  // 7.0 m/s when capped at 3,000 rpm; P/D 1.4 reaches 11.2 m/s on the same power.
  it('issue 15’s figures: P/D 0.7 capped at 3,000 rpm → 7.0 m/s; P/D 1.4 on 6 kW → 11.2 m/s (±0.05)', () => {
    const base = { maxTorque_Nm: 10000, bladeAreaRatio: 0.35 };
    const defaults = {
      length_m: 5.5,
      wettedArea_m2: 3,
      formFactor: 1,
      appendageDragArea_m2: 0,
      wakeFraction: 0,
      thrustDeduction: 0,
    };
    const fine = sprint({ ...defaults, ...base, pitchRatio: 0.7 }).o;
    const coarse = sprint({ ...defaults, ...base, pitchRatio: 1.4 }).o;
    expect(Math.abs(fine.topSpeed_mps - 7.0)).toBeLessThan(0.05);
    expect(fine.limitedBy).toBe('rpm');
    expect(Math.abs(coarse.topSpeed_mps - 11.2)).toBeLessThan(0.05);
    expect(coarse.limitedBy).toBe('power');
  });

  it('a top speed beyond the model’s 30 m/s → out_of_range', () => {
    const r = runCalculator('sprint', {
      ...BOAT,
      wettedArea_m2: 0.05,
      length_m: 0.3,
      maxShaftPower_W: 500000,
      maxTorque_Nm: 10000,
      maxRpm: 20000,
    });
    expect(r).toMatchObject({ ok: false, error: 'out_of_range' });
  });
});
