import { describe, it, expect } from 'vitest';
import { describeInputs } from '../../src/lib/calc-describe';
import { calculators, calculatorKinds } from '../../src/lib/calc';

describe('describeInputs: a calculation’s inputs in words (search snippets)', () => {
  it('names a propeller’s inputs by their labels, with units, never by field keys', () => {
    const text = describeInputs('propeller', {
      blades: 3,
      bladeAreaRatio: 0.55,
      pitchRatio: 1.0,
      diameter_m: 0.2,
      rpm: 1200,
      speed_mps: 2.5,
      wakeFraction: 0,
      temperature_C: 20,
      water: 'fresh',
    });
    expect(text).toMatch(/^Blades 3, /);
    expect(text).toContain('pitch ratio 1');
    expect(text).toContain('diameter 0.2 m');
    expect(text).toContain('Fresh water');
    expect(text).not.toMatch(/pitchRatio|diameter_m|speed_mps|_C\b/);
  });

  it('leaves out inputs the chosen option hides', () => {
    const text = describeInputs('cooling', { heatFrom: 'heat', heat_W: 180, inputPower_W: 4000, flow_lpm: 2 });
    expect(text).toContain('180 W');
    expect(text).not.toContain('4,000');
  });

  it('describes every calculator’s defaults without a field key', () => {
    for (const kind of calculatorKinds) {
      const defaults = Object.fromEntries(calculators[kind].inputs.map((m) => [m.name, m.default]));
      const text = describeInputs(kind, defaults);
      expect(text.length, kind).toBeGreaterThan(5);
      for (const m of calculators[kind].inputs) if (m.name.includes('_')) expect(text, kind).not.toContain(m.name);
    }
    expect(describeInputs('no-such-kind', { a: 1 })).toBe('');
  });
});
