import { describe, expect, it } from 'vitest';
import { calculatorKinds, calculators, runCalculator } from '../../../src/lib/calc';

// Deterministic pseudo-random inputs inside each schema: every run either succeeds with finite (or null)
// outputs or reports out_of_range — never throws, never NaN. (The engine itself uses no randomness.)
function lcg(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

describe('inputs anywhere inside the schema never break a calculator', () => {
  for (const kind of calculatorKinds) {
    it(kind, () => {
      const calc = calculators[kind];
      const rnd = lcg(kind.length * 7919 + 17);
      const runs = kind === 'propeller-sweep' ? 12 : 150;
      let ok = 0;
      for (let i = 0; i < runs; i++) {
        const inputs: Record<string, unknown> = {};
        for (const m of calc.inputs) {
          if (rnd() < 0.3) continue; // leave some at their defaults
          if (m.kind === 'choice') inputs[m.name] = m.options![Math.floor(rnd() * m.options!.length)].value;
          else {
            // log-uniform for wide ranges so small values are exercised too
            const lo = m.min!,
              hi = m.max!;
            let v =
              lo > 0 && hi / lo > 100 ? Math.exp(Math.log(lo) + rnd() * Math.log(hi / lo)) : lo + rnd() * (hi - lo);
            if (m.kind === 'integer') v = Math.round(v);
            inputs[m.name] = v;
          }
        }
        if (kind === 'propeller-sweep') {
          inputs.pitchSteps = 4;
          inputs.areaSteps = 4;
          delete inputs.pitchRatioMin;
          delete inputs.pitchRatioMax;
          delete inputs.bladeAreaRatioMin;
          delete inputs.bladeAreaRatioMax;
        }
        const r = runCalculator(kind, inputs);
        if (r.ok) {
          ok++;
          for (const [k, v] of Object.entries(r.result.outputs))
            expect(
              v === null || typeof v === 'string' || Number.isFinite(v),
              `${kind}.${k} = ${v} for ${JSON.stringify(inputs)}`,
            ).toBe(true);
          for (const s of Object.values(r.result.series ?? {}))
            for (const y of [s.x, ...s.y])
              expect(y.values.every(Number.isFinite), `${kind} series ${y.name}`).toBe(true);
        } else if (r.error === 'invalid_input') {
          // only the cross-field rules may refuse (cooling pipe pair, sweep ranges)
          expect(['cooling', 'propeller-sweep']).toContain(kind);
        } else expect(r.error).toBe('out_of_range');
      }
      expect(ok).toBeGreaterThan(0);
    });
  }
});
