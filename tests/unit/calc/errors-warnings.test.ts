import { describe, expect, it } from 'vitest';
import { calculators, runCalculator } from '../../../src/lib/calc';
import { timesTenTo } from '../../../src/lib/calc/numeric';

describe('out-of-range errors name the input', () => {
  const cases: [string, object, string][] = [
    ['propeller', { blades: 8 }, 'blades'],
    ['propeller', { blades: 1 }, 'blades'],
    ['propeller', { bladeAreaRatio: 0.25 }, 'bladeAreaRatio'],
    ['propeller', { bladeAreaRatio: 1.1 }, 'bladeAreaRatio'],
    ['propeller', { pitchRatio: 0.45 }, 'pitchRatio'],
    ['propeller', { pitchRatio: 1.5 }, 'pitchRatio'],
    ['propeller', { rpm: 100, speed_mps: 6 }, 'rpm'],
    ['race', { pitchRatio: 1.6 }, 'pitchRatio'],
    ['race', { blades: 9 }, 'blades'],
    ['race', { batteryEnergy_Wh: 0, solarPower_W: 0 }, 'batteryEnergy_Wh'],
    ['resistance', { speed_mps: 0.01, length_m: 1 }, 'speed_mps'],
    ['cooling', { heat_W: 5000, flow_lpm: 0.05, inlet_C: 30 }, 'flow_lpm'],
    ['cooling', { inlet_C: -5, coolant: 'water' }, 'inlet_C'],
  ];
  for (const [kind, inputs, name] of cases) {
    it(`${kind} ${JSON.stringify(inputs)} → ${name}`, () => {
      const r = runCalculator(kind, inputs);
      expect(r).toMatchObject({ ok: false, error: 'out_of_range', input: name });
      if (!r.ok && r.error === 'out_of_range') expect(r.message.length).toBeGreaterThan(20);
    });
  }
});

describe('warnings where specified', () => {
  const warnings = (kind: string, inputs: object) => {
    const r = runCalculator(kind, inputs);
    if (!r.ok) throw new Error(JSON.stringify(r));
    return r.result.warnings.join('\n');
  };

  it('blade area outside the tested coverage for Z warns; inside does not', () => {
    expect(warnings('propeller', { blades: 3, bladeAreaRatio: 0.95 })).toMatch(
      /outside the blade areas actually tested for 3 blades/,
    );
    expect(warnings('propeller', { blades: 2, bladeAreaRatio: 0.5 })).toMatch(/tested for 2 blades/);
    expect(warnings('propeller', { blades: 4, bladeAreaRatio: 0.7 })).not.toMatch(/tested for/);
  });

  it('Rn₀.₇₅ below 2·10⁶ warns; a large fast propeller above it does not', () => {
    expect(warnings('propeller', { diameter_m: 0.2, rpm: 1500, speed_mps: 4 })).toMatch(/Rn₀\.₇₅/);
    expect(
      warnings('propeller', { blades: 4, bladeAreaRatio: 0.7, diameter_m: 2.5, rpm: 300, speed_mps: 8 }),
    ).not.toMatch(/Rn₀\.₇₅/);
  });

  it('negative thrust warns and leaves efficiency empty', () => {
    const r = runCalculator('propeller', { rpm: 600, speed_mps: 2.5, pitchRatio: 0.8 });
    if (!r.ok) throw new Error(JSON.stringify(r));
    expect(r.result.outputs.efficiency).toBeNull();
    expect(r.result.warnings.join(' ')).toMatch(/no thrust/);
  });

  it('solar warns that deck-mounted panels run hotter than NOCT', () => {
    expect(warnings('solar', {})).toMatch(/hotter than NOCT/);
  });

  it('cable warns above 3 % drop (common practice) and not below', () => {
    expect(warnings('cable', { current_A: 150, length_m: 6, crossSection_mm2: 10, systemVoltage_V: 24 })).toMatch(
      /above the 3 %/,
    );
    expect(warnings('cable', { current_A: 20, length_m: 1, crossSection_mm2: 16, systemVoltage_V: 48 })).not.toMatch(
      /3 %/,
    );
  });

  it('sweep says two propellers are common practice, and flags unmodelled cavitation', () => {
    expect(calculators['propeller-sweep'].summary).toMatch(/two propellers.*\(common practice\)/);
    expect(warnings('propeller-sweep', {})).toMatch(/[Cc]avitation/);
  });

  it('glycol coolant properties come from a published correlation now, so no memory warning remains (issue 15)', () => {
    expect(warnings('cooling', { coolant: 'glycol50' })).not.toMatch(/memory/);
    expect(calculators.cooling.sources.map((s) => s.citation).join(' ')).toMatch(/Melinder \(2010\)/);
  });
  it('a weak glycol mix warns about frost and corrosion protection (common practice)', () => {
    expect(warnings('cooling', { coolant: 'glycol', glycolFraction: 0.1 })).toMatch(/frost protection/);
  });
});

describe('numbers in warning text', () => {
  it('are written 1.3·10⁶, never 1.3e+6', () => {
    expect(timesTenTo(1.26e6, 1)).toBe('1.3·10⁶');
    expect(timesTenTo(4.2e-7, 2)).toBe('4.20·10⁻⁷');
    // a small propeller at low speed is below the series' Reynolds number, and a short slow hull below 1·10⁵
    // what a person reads: the warnings of a result, or the sentence of a refusal (422)
    const textOf = (kind: string, inputs: object) => {
      const r = runCalculator(kind, inputs);
      return r.ok ? r.result.warnings : 'message' in r ? [r.message] : [];
    };
    const all = [
      ...textOf('propeller', { diameter_m: 0.1, rpm: 600, speed_mps: 0.5 }),
      ...textOf('resistance', { length_m: 0.3, speed_mps: 0.2 }),
    ].join(' ');
    expect(all).toMatch(/·10⁵|·10⁴/);
    expect(all).not.toMatch(/\de[+-]\d/);
  });
});
