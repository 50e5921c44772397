// Calculator engine benchmarks: one propeller evaluation, one race solve, one sprint, one ~200-propeller sweep.
// Each goes through runCalculator (schema parse + compute), as the API does.
import { runCalculator } from '../src/lib/calc/index';
import { bSeries } from '../src/lib/calc/bseries';
import { operatingPoint } from '../src/lib/calc/propeller';
import { summarize, timeIt, type BenchSummary } from './stats';

function mustRun(kind: string, inputs: object) {
  const r = runCalculator(kind, inputs);
  if (!r.ok) throw new Error(`${kind} failed in benchmark: ${JSON.stringify(r)}`);
  return r;
}

export default function benchCalc(): BenchSummary[] {
  const out: BenchSummary[] = [];

  const propRuns = 20000;
  const prop = timeIt(
    (i) =>
      mustRun('propeller', {
        blades: 3,
        bladeAreaRatio: 0.5,
        pitchRatio: 1.0,
        diameter_m: 0.2,
        rpm: 1200 + (i % 800),
        speed_mps: 4,
        temperature_C: 20,
      }),
    propRuns,
  );
  out.push(
    summarize('calc.propeller.evaluate', prop, {
      docs: 'B-series K_T/K_Q, thrust, torque, power and the 41-point open-water series',
    }),
  );

  // The evaluation alone: B-series K_T/K_Q polynomials collapsed for one geometry, and the operating point at one
  // advance ratio (what a solver or sweep calls many times), without schema parsing or the chart series.
  const point = timeIt(
    (i) => operatingPoint(bSeries(3, 0.5, 0.9 + (i % 40) * 0.01), 0.2, 20 + (i % 10), 4, 998.2),
    propRuns,
  );
  out.push(
    summarize('calc.propeller.point', point, {
      docs: 'B-series polynomials for one geometry + thrust, torque, power, efficiency at one J',
    }),
  );

  const raceRuns = 1000;
  const race = timeIt(
    (i) => mustRun('race', { batteryEnergy_Wh: 1400 + (i % 600), pitchRatio: 1.0 + (i % 5) * 0.05 }),
    raceRuns,
  );
  out.push(
    summarize('calc.race.solve', race, {
      docs: 'speed and rpm where T(1−t) = R and P_D = budget, plus the 31-point power series',
    }),
  );

  // Standing-start sprint inside the motor's envelope, over a spread of propellers and motors.
  const sprintRuns = 500;
  const sprint = timeIt(
    (i) =>
      mustRun('sprint', {
        pitchRatio: 0.8 + (i % 7) * 0.1,
        bladeAreaRatio: 0.4 + (i % 4) * 0.1,
        maxShaftPower_W: 3000 + (i % 5) * 1000,
      }),
    sprintRuns,
  );
  out.push(
    summarize('calc.sprint.solve', sprint, {
      docs: 'top speed, RK4 run over 200 m inside the power/rpm/torque envelope, cavitation checks, two series',
      target_p99_ms: 20,
    }),
  );

  const sweepRuns = 15;
  const sweep = timeIt((i) => mustRun('propeller-sweep', { batteryEnergy_Wh: 1600 + i * 10 }), sweepRuns, 2);
  out.push(
    summarize('calc.propeller-sweep.204', sweep, {
      docs: '17 × 12 = 204 propellers: race solve inside the envelope + sprint over 200 m + cavitation checks each',
      target_p99_ms: 1000,
    }),
  );

  return out;
}
