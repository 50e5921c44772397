import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { cavitationCheck, cavitationEnv } from '../../src/lib/calc/cavitation';
import { energyBudget } from '../../src/lib/calc/energy';
import { raceContext } from '../../src/lib/calc/race';

// Race point inside the motor's envelope. Propeller: Wageningen B-series polynomials (Oosterveld & van Oossanen 1975,
// Table 5); hull: ITTC-1957 line with form factor (REFERENCES.md §1–2); cavitation: Burrill (1943) / Burrill &
// Emerson (1963) thrust loading and Keller (1966) blade area as in J. Carlton, "Marine Propellers and Propulsion".
// These are physical-sanity checks: the envelope is arithmetic (P = 2π·n·Q), not an empirical model.

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
  maxShaftPower_W: 6000,
  maxRpm: 3000,
  maxTorque_Nm: 20,
  shaftDepth_m: 0.3,
  kellerK: 0.2,
};

function race(over: object = {}) {
  const r = runCalculator('race', { ...BOAT, ...over });
  if (!r.ok) throw new Error(JSON.stringify(r));
  return { o: r.result.outputs as Record<string, number & string>, warnings: r.result.warnings };
}

describe('race point inside the motor’s envelope', () => {
  it('with a roomy envelope the budget sets the speed (limitedBy energy, shaft power = budget)', () => {
    const { o } = race();
    expect(o.limitedBy).toBe('energy');
    const b = energyBudget(BOAT);
    expect(Math.abs(o.shaftPower_W - b.averageShaftPower_W) / b.averageShaftPower_W).toBeLessThan(1e-6);
  });

  it.each([
    ['rpm', { maxRpm: 1200 }, 'rpm', 1200],
    ['power', { maxShaftPower_W: 500 }, 'shaftPower_W', 500],
    ['torque', { maxTorque_Nm: 3 }, 'torque_Nm', 3],
  ] as const)('a tight %s limit holds the race point exactly on it and slows the boat', (limit, over, output, cap) => {
    const free = race().o;
    const { o, warnings } = race(over);
    expect(o.limitedBy).toBe(limit);
    expect(Math.abs(o[output] - cap) / cap).toBeLessThan(1e-6);
    expect(o.speed_mps).toBeLessThan(free.speed_mps);
    expect(warnings.some((w) => w.includes(`${limit} limit`))).toBe(true);
  });

  it('never exceeds any limit over a spread of motors and budgets', () => {
    for (const maxRpm of [900, 1500, 3000])
      for (const maxShaftPower_W of [400, 900, 4000])
        for (const maxTorque_Nm of [2, 5, 20])
          for (const batteryEnergy_Wh of [800, 1800, 4000]) {
            const r = runCalculator('race', { ...BOAT, maxRpm, maxShaftPower_W, maxTorque_Nm, batteryEnergy_Wh });
            if (!r.ok) {
              expect(r.error).toBe('out_of_range');
              continue;
            }
            const o = r.result.outputs as Record<string, number>;
            expect(o.rpm).toBeLessThanOrEqual(maxRpm * (1 + 1e-9));
            expect(o.shaftPower_W).toBeLessThanOrEqual(maxShaftPower_W * (1 + 1e-9));
            expect(o.torque_Nm).toBeLessThanOrEqual(maxTorque_Nm * (1 + 1e-9));
            expect(o.shaftPower_W).toBeLessThanOrEqual(
              energyBudget({ ...BOAT, batteryEnergy_Wh }).averageShaftPower_W * (1 + 1e-9),
            );
          }
  });

  it('a limit already passed at the lowest speed → out_of_range naming that input', () => {
    expect(runCalculator('race', { ...BOAT, maxRpm: 10 })).toMatchObject({
      ok: false,
      error: 'out_of_range',
      input: 'maxRpm',
    });
  });

  it('its cavitation outputs are the checks at the race point', () => {
    const { o } = race();
    const ctx = raceContext(BOAT as never);
    const c = cavitationCheck(
      ctx.prop,
      BOAT.diameter_m,
      o.rpm / 60,
      o.speed_mps * (1 - BOAT.wakeFraction),
      o.thrust_N,
      cavitationEnv(BOAT as never, ctx.rho),
    );
    expect(o.cavitationNumber).toBeCloseTo(c.cavitationNumber, 12);
    expect(o.thrustLoadingCoefficient).toBeCloseTo(c.thrustLoadingCoefficient, 12);
    expect(o.kellerMinBladeAreaRatio).toBeCloseTo(c.kellerMinBladeAreaRatio, 12);
  });
});
