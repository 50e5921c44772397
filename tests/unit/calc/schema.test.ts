import { describe, expect, it } from 'vitest';
import { calculatorKinds, calculators, getCalculator, runCalculator } from '../../../src/lib/calc';

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
        for (const m of calc.inputs) if (m.default !== undefined) expect(parsed[m.name], m.name).toBe(m.default);
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

  it('cooling needs the heat or both input power and efficiency', () => {
    const r = runCalculator('cooling', { inputPower_W: 3000 });
    expect(r).toMatchObject({ ok: false, error: 'invalid_input' });
    if (!r.ok && r.error === 'invalid_input') expect(r.issues.map((i) => i.path)).toContain('efficiency');
    const h = runCalculator('cooling', { heat_W: 150 });
    if (!h.ok) throw new Error(JSON.stringify(h));
    expect(h.result.outputs.heat_W).toBe(150);
    const p = runCalculator('cooling', { inputPower_W: 3000, efficiency: 0.95 });
    if (!p.ok) throw new Error(JSON.stringify(p));
    expect(p.result.outputs.heat_W).toBeCloseTo(150, 9);
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
