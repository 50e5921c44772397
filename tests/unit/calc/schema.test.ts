import { describe, expect, it } from 'vitest';
import { calculatorKinds, calculators, getCalculator, runCalculator } from '../../../src/lib/calc';
import { activeInputs } from '../../../src/lib/calc/fields';

const kinds = calculatorKinds;

describe('every calculator', () => {
  it('is registered under its own kind', () => {
    expect([...kinds].sort()).toEqual([
      'battery',
      'cable',
      'cooling',
      'energy',
      'foil',
      'planing',
      'propeller',
      'propeller-sweep',
      'race',
      'resistance',
      'solar',
      'sprint',
      'water',
    ]);
    for (const k of kinds) expect(getCalculator(k)?.kind).toBe(k);
    expect(getCalculator('nope')).toBeUndefined();
    expect(getCalculator('toString')).toBeUndefined();
  });

  for (const kind of kinds) {
    const calc = calculators[kind];
    describe(kind, () => {
      it('runs on {} with its defaults, giving finite numbers, text or null for every declared output', () => {
        const r = runCalculator(kind, {});
        if (!r.ok) throw new Error(JSON.stringify(r));
        for (const o of calc.outputs) {
          const v = r.result.outputs[o.name];
          expect(
            v === null || (typeof v === 'number' && Number.isFinite(v)) || (typeof v === 'string' && v.length > 0),
            `${o.name} = ${v}`,
          ).toBe(true);
        }
        expect(Object.keys(r.result.outputs).sort()).toEqual(calc.outputs.map((o) => o.name).sort());
        expect(r.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
      });

      it('applies each declared default', () => {
        const parsed = calc.inputSchema.parse({}) as unknown as Record<string, unknown>;
        // An input the default choices hide is left out altogether (it must not feed the result unseen).
        const active = new Set(activeInputs(calc.inputs, parsed).map((m) => m.name));
        for (const m of calc.inputs)
          if (m.default !== undefined) expect(parsed[m.name], m.name).toBe(active.has(m.name) ? m.default : undefined);
      });

      it('has inputs with help text, and numeric inputs with min and max', () => {
        for (const m of calc.inputs) {
          expect(m.help.length, m.name).toBeGreaterThan(10);
          if (m.kind !== 'choice') {
            expect(typeof m.min, m.name).toBe('number');
            expect(typeof m.max, m.name).toBe('number');
          } else expect(m.options!.length).toBeGreaterThan(1);
          if (typeof m.default === 'number') {
            expect(m.default).toBeGreaterThanOrEqual(m.min!);
            expect(m.default).toBeLessThanOrEqual(m.max!);
          }
        }
      });

      it('enforces exactly the min and max its metadata shows', () => {
        for (const m of calc.inputs) {
          if (m.kind === 'choice') continue;
          const issueAt = (v: number) => {
            const r = calc.inputSchema.safeParse({ [m.name]: v });
            // cross-field rules (e.g. lowest ≤ highest) are custom issues, not the field's own limits
            return !r.success && r.error.issues.some((i) => i.path[0] === m.name && i.code !== 'custom');
          };
          const eps = m.kind === 'integer' ? 1 : Math.max(1e-9, Math.abs(m.max! - m.min!) * 1e-9);
          expect(issueAt(m.min! - eps), `${m.name} below min`).toBe(true);
          expect(issueAt(m.max! + eps), `${m.name} above max`).toBe(true);
          expect(issueAt(m.min!), `${m.name} at min`).toBe(false);
          expect(issueAt(m.max!), `${m.name} at max`).toBe(false);
        }
      });

      it('rejects wrong types with invalid_input naming the field', () => {
        for (const m of calc.inputs) {
          const bad = m.kind === 'choice' ? 'not-an-option' : 'twelve';
          const r = runCalculator(kind, { [m.name]: bad });
          expect(r.ok).toBe(false);
          if (!r.ok && r.error === 'invalid_input') expect(r.issues.some((i) => i.path === m.name)).toBe(true);
          else throw new Error(`expected invalid_input for ${m.name}`);
        }
      });

      it('names sources with full citations', () => {
        expect(calc.sources.length).toBeGreaterThan(0);
        for (const s of calc.sources) {
          expect(s.citation.length).toBeGreaterThan(30);
          expect(s.use.length).toBeGreaterThan(5);
        }
      });
    });
  }

  it('integer inputs reject fractions', () => {
    expect(runCalculator('propeller', { blades: 3.5 })).toMatchObject({ ok: false, error: 'invalid_input' });
  });

  it('non-finite and null values are rejected for required numbers; null is accepted for optional ones', () => {
    expect(runCalculator('solar', { area_m2: null })).toMatchObject({ ok: false, error: 'invalid_input' });
    expect(runCalculator('cooling', { heat_W: null, inputPower_W: 2000, efficiency: 0.95 }).ok).toBe(true);
  });

  it('cooling uses only the inputs of the chosen heat option (issue 14: 120 W came from hidden defaults)', () => {
    const heat = (r: ReturnType<typeof runCalculator>) => {
      if (!r.ok) throw new Error(JSON.stringify(r));
      return r.result.outputs.heat_W;
    };
    // Heat given: input power and efficiency are ignored even when sent, and not kept with the inputs.
    const given = runCalculator('cooling', { heatFrom: 'heat', heat_W: 500, inputPower_W: 4000, efficiency: 0.97 });
    expect(heat(given)).toBe(500);
    if (given.ok) expect(Object.keys(given.inputs)).not.toContain('inputPower_W');
    // A stale, even invalid, hidden value cannot fail the form.
    expect(heat(runCalculator('cooling', { heatFrom: 'heat', heat_W: 80, efficiency: 'abc' }))).toBe(80);
    // Losses chosen: a heat figure left in the form is ignored.
    const losses = runCalculator('cooling', { heatFrom: 'losses', heat_W: 500, inputPower_W: 3000, efficiency: 0.95 });
    expect(heat(losses)).toBeCloseTo(150, 9);
    if (losses.ok) expect(Object.keys(losses.inputs)).not.toContain('heat_W');
    // Without the choice (older saved calculations, API callers), what is given decides.
    expect(heat(runCalculator('cooling', { heat_W: 150 }))).toBe(150);
    expect(heat(runCalculator('cooling', { inputPower_W: 3000, efficiency: 0.95 }))).toBeCloseTo(150, 9);
    const bad = runCalculator('cooling', { heatFrom: 'losses', efficiency: 2 });
    expect(bad).toMatchObject({ ok: false, error: 'invalid_input' });
    if (!bad.ok && bad.error === 'invalid_input') expect(bad.issues.map((i) => i.path)).toEqual(['efficiency']);
    expect(runCalculator('cooling', { pipeBore_mm: 8 })).toMatchObject({ ok: false, error: 'invalid_input' });
  });

  it('an unknown kind is invalid input on the path kind', () => {
    expect(runCalculator('warp-drive', {})).toMatchObject({
      ok: false,
      error: 'invalid_input',
      issues: [{ path: 'kind' }],
    });
  });

  it('cautions are present where people can get hurt', () => {
    for (const k of [
      'propeller',
      'race',
      'propeller-sweep',
      'energy',
      'cable',
      'cooling',
      'sprint',
      'battery',
    ] as const) {
      expect(calculators[k].cautions.length, k).toBeGreaterThan(0);
      expect(calculators[k].cautions.join(' '), k).toMatch(/race rules|qualified/);
    }
    expect(calculators.propeller.cautions.join(' ')).toMatch(/propeller/i);
    expect(calculators.cooling.cautions.join(' ')).toMatch(/pressure/i);
    expect(calculators.cable.cautions.join(' ')).toMatch(/fuse/i);
    expect(calculators.sprint.cautions.join(' ')).toMatch(/propeller/i);
    expect(calculators.battery.cautions.join(' ')).toMatch(/fuse/i);
    expect(calculators.battery.cautions.join(' ')).toMatch(/thermal runaway/i);
  });
});
