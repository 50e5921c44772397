import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';

// Sweep scoring with the sprint: the sprint pick is the quickest propeller over the sprint distance among those that
// pass Burrill's (1943; Burrill & Emerson 1963) and Keller's (1966) criteria at sprint top speed, as given in
// J. Carlton, "Marine Propellers and Propulsion"; the endurance pick the fastest race point among those passing at the
// race point. Propeller data: Oosterveld & van Oossanen (1975), Table 5. Physical-sanity and consistency checks.

const run = (kind: string, inputs: object) => {
  const r = runCalculator(kind, inputs);
  if (!r.ok) throw new Error(JSON.stringify(r));
  return r.result;
};

describe('propeller sweep with sprint scoring (defaults)', () => {
  const result = run('propeller-sweep', {});
  const o = result.outputs as Record<string, number & string>;
  const sprintGrid = result.grids![0];

  it('the sprint pick has the shortest time among the cells that pass, and the sprint kind agrees', () => {
    const times: number[] = [];
    sprintGrid.z.values.forEach((row, yi) =>
      row.forEach((t, xi) => {
        if (t !== null && !sprintGrid.failed![yi][xi]) times.push(t);
      }),
    );
    expect(o.bestSprintTime_s).toBe(Math.min(...times));
    const s = run('sprint', {
      pitchRatio: o.bestSprintPitchRatio,
      bladeAreaRatio: o.bestSprintBladeAreaRatio,
    }).outputs as Record<string, number>;
    expect(s.time_s).toBeCloseTo(o.bestSprintTime_s, 9);
    expect(s.topSpeed_mps).toBeCloseTo(o.bestSprintTopSpeed_mps, 9);
  });

  it('the endurance pick is the fastest passing race point, and race agrees', () => {
    const g = result.grid!;
    const speeds: number[] = [];
    g.z.values.forEach((row, yi) =>
      row.forEach((v, xi) => {
        if (v !== null && !g.failed![yi][xi]) speeds.push(v);
      }),
    );
    expect(o.bestEnduranceSpeed_mps).toBe(Math.max(...speeds));
    const r = run('race', {
      pitchRatio: o.bestEndurancePitchRatio,
      bladeAreaRatio: o.bestEnduranceBladeAreaRatio,
    }).outputs as Record<string, number & string>;
    expect(r.speed_mps).toBeCloseTo(o.bestEnduranceSpeed_mps, 6);
    expect(r.limitedBy).toBe(o.enduranceLimitedBy);
  });

  it('greyed cells are exactly those the sprint kind warns about; picks are marked and named', () => {
    let checked = 0;
    sprintGrid.failed!.forEach((row, yi) =>
      row.forEach((failed, xi) => {
        if ((yi + xi) % 9 !== 0 || sprintGrid.z.values[yi][xi] === null) return;
        const s = run('sprint', { pitchRatio: sprintGrid.y.values[yi], bladeAreaRatio: sprintGrid.x.values[xi] });
        expect(
          s.warnings.some((w) => w.startsWith('Cavitation at top speed')),
          `${yi},${xi}`,
        ).toBe(failed);
        checked++;
      }),
    );
    expect(checked).toBeGreaterThan(10);
    expect(o.sprintCavitationFailures).toBe(sprintGrid.failed!.flat().filter(Boolean).length);
    expect(sprintGrid.picks).toEqual([
      expect.objectContaining({ x: o.bestSprintBladeAreaRatio, y: o.bestSprintPitchRatio }),
    ]);
    expect(result.grid!.picks).toEqual([
      expect.objectContaining({ x: o.bestEnduranceBladeAreaRatio, y: o.bestEndurancePitchRatio }),
    ]);
    expect(o.sprintBest).toContain(`P/D ${(o.bestSprintPitchRatio as number).toFixed(2)}`);
    expect(o.enduranceBest).toContain(`P/D ${(o.bestEndurancePitchRatio as number).toFixed(2)}`);
  });

  it('a pick on the grid’s edge is marked so in its name and in a warning', () => {
    const onEdge = (pd: number) => pd === 0.6 || pd === 1.4;
    if (onEdge(o.bestEndurancePitchRatio)) {
      expect(o.enduranceBest).toContain('on the grid’s edge');
      expect(result.warnings.some((w) => w.startsWith('The best endurance propeller lies on the edge'))).toBe(true);
    }
    const narrow = run('propeller-sweep', { pitchRatioMin: 0.6, pitchRatioMax: 0.9, pitchSteps: 4, areaSteps: 3 });
    const n = narrow.outputs as Record<string, number & string>;
    expect(n.bestSprintPitchRatio).toBe(0.9); // sprint wants more pitch than this range offers
    expect(n.sprintBest).toContain('on the grid’s edge');
  });

  it('no longer picks the old thrust-at-1-m/s propeller (P/D 0.7, A_E/A_0 0.35); the pick is faster than its 7.0 m/s', () => {
    expect(o.bestSprintPitchRatio).toBeGreaterThan(0.7);
    expect(o.bestSprintTopSpeed_mps).toBeGreaterThan(7.0);
  });

  it('more motor power shortens the best sprint time (physical sanity)', () => {
    const more = run('propeller-sweep', { maxShaftPower_W: 9000, maxTorque_Nm: 40, pitchSteps: 6, areaSteps: 4 })
      .outputs as Record<string, number>;
    const less = run('propeller-sweep', { maxShaftPower_W: 4000, maxTorque_Nm: 40, pitchSteps: 6, areaSteps: 4 })
      .outputs as Record<string, number>;
    expect(more.bestSprintTime_s).toBeLessThan(less.bestSprintTime_s);
  });
});
