import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../../src/lib/calc';
import { energyBudget } from '../../../src/lib/calc/energy';
import { waterProperties } from '../../../src/lib/calc/properties/water';
import { hullResistance } from '../../../src/lib/calc/resistance';

const BOAT = {
  length_m: 5.5,
  wettedArea_m2: 3.1,
  formFactor: 1.12,
  appendageDragArea_m2: 0.003,
  temperature_C: 18,
  water: 'fresh',
  blades: 3,
  bladeAreaRatio: 0.45,
  pitchRatio: 1.2,
  diameter_m: 0.2,
  wakeFraction: 0.04,
  thrustDeduction: 0.03,
  batteryEnergy_Wh: 1800,
  usableFraction: 0.9,
  raceDuration_h: 2,
  solarPower_W: 280,
  drivetrainEfficiency: 0.86,
};

describe('race operating point', () => {
  it('is self-consistent: T·(1−t) = R(V), shaft power = the budget, rpm and J agree', () => {
    const r = runCalculator('race', BOAT);
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    const w = waterProperties(18, 'fresh');
    const R = hullResistance(BOAT as never, o.speed_mps, w.density_kgm3, w.kinematicViscosity_m2s).total_N;
    expect(o.resistance_N).toBeCloseTo(R, 6);
    expect(Math.abs(o.thrust_N * (1 - BOAT.thrustDeduction) - R) / R).toBeLessThan(1e-8);
    const b = energyBudget(BOAT);
    expect(Math.abs(o.shaftPower_W - b.averageShaftPower_W) / b.averageShaftPower_W).toBeLessThan(1e-6);
    expect(o.electricalPower_W).toBeCloseTo(b.averageElectricalPower_W, 9);
    const n = o.rpm / 60;
    expect(o.advanceRatio).toBeCloseTo((o.speed_mps * (1 - BOAT.wakeFraction)) / (n * BOAT.diameter_m), 9);
    expect(o.shaftPower_W).toBeCloseTo(2 * Math.PI * n * o.torque_Nm, 6);
    expect(o.speed_mps).toBeGreaterThan(3);
    expect(o.speed_mps).toBeLessThan(8);
  });

  it('the power series brackets the operating point and rises with speed', () => {
    const r = runCalculator('race', BOAT);
    if (!r.ok) throw new Error(JSON.stringify(r));
    const s = r.result.series!.power;
    const v = (r.result.outputs as Record<string, number>).speed_mps;
    expect(s.x.values[0]).toBeLessThan(v);
    expect(s.x.values[s.x.values.length - 1]).toBeGreaterThan(v);
    const need = s.y[0].values;
    for (let i = 1; i < need.length; i++) expect(need[i]).toBeGreaterThan(need[i - 1]);
  });

  it('more energy gives more speed; more resistance gives less', () => {
    const speed = (over: object) => {
      const r = runCalculator('race', { ...BOAT, ...over });
      if (!r.ok) throw new Error(JSON.stringify(r));
      return (r.result.outputs as Record<string, number>).speed_mps;
    };
    expect(speed({ batteryEnergy_Wh: 2500 })).toBeGreaterThan(speed({}));
    expect(speed({ formFactor: 1.3 })).toBeLessThan(speed({}));
  });

  it('no energy → out_of_range naming batteryEnergy_Wh', () => {
    const r = runCalculator('race', { ...BOAT, batteryEnergy_Wh: 0, solarPower_W: 0 });
    expect(r).toMatchObject({ ok: false, error: 'out_of_range', input: 'batteryEnergy_Wh' });
  });
});

describe('propeller sweep', () => {
  it('evaluates ~200 propellers, fills the grid and picks the best of it', () => {
    const r = runCalculator('propeller-sweep', { ...BOAT });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    expect(o.evaluated).toBe(17 * 12);
    const g = r.result.grid!;
    expect(g.z.values).toHaveLength(g.y.values.length);
    for (const row of g.z.values) expect(row).toHaveLength(g.x.values.length);
    const all = g.z.values.flat().filter((v): v is number => v !== null);
    expect(Math.max(...all)).toBe(o.bestEnduranceSpeed_mps);
    // the best endurance propeller's race solve gives the same speed
    const race = runCalculator('race', {
      ...BOAT,
      pitchRatio: o.bestEndurancePitchRatio,
      bladeAreaRatio: o.bestEnduranceBladeAreaRatio,
    });
    if (!race.ok) throw new Error(JSON.stringify(race));
    expect((race.result.outputs as Record<string, number>).speed_mps).toBeCloseTo(o.bestEnduranceSpeed_mps, 6);
    // blade areas default to the tested coverage for three blades (0.35–0.80)
    expect(g.x.values[0]).toBeCloseTo(0.35, 12);
    expect(g.x.values[g.x.values.length - 1]).toBeCloseTo(0.8, 12);
  });

  it('sprint and endurance choices differ: sprint favours finer pitch than endurance', () => {
    const r = runCalculator('propeller-sweep', { ...BOAT });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    expect(o.bestSprintPitchRatio).toBeLessThan(o.bestEndurancePitchRatio);
    expect(o.bestSprintThrust_N).toBeGreaterThan(0);
  });

  it('pitch range beyond the series → out_of_range naming the bound', () => {
    expect(runCalculator('propeller-sweep', { pitchRatioMax: 1.6 })).toMatchObject({
      ok: false,
      error: 'out_of_range',
      input: 'pitchRatioMax',
    });
    expect(runCalculator('propeller-sweep', { pitchRatioMin: 0.4 })).toMatchObject({
      ok: false,
      error: 'out_of_range',
      input: 'pitchRatioMin',
    });
    expect(runCalculator('propeller-sweep', { blades: 9 })).toMatchObject({
      ok: false,
      error: 'out_of_range',
      input: 'blades',
    });
  });
});
