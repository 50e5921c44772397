import { z } from 'zod';
import type { InputMeta } from './types';

// Each calculator declares its inputs once, as metadata; the zod schema is built from that list so the
// form limits shown on screen and the limits the server enforces cannot drift apart.

type NumberSpec = Omit<InputMeta, 'kind' | 'options'> & { min: number; max: number };

export function num(spec: NumberSpec): InputMeta {
  return { kind: 'number', ...spec };
}

export function int(spec: NumberSpec): InputMeta {
  return { kind: 'integer', step: 1, ...spec };
}

export function choice(
  spec: Omit<InputMeta, 'kind' | 'min' | 'max' | 'step'> & { options: { value: string; label: string }[] },
): InputMeta {
  return { kind: 'choice', ...spec };
}

export function fieldSchema(meta: InputMeta): z.ZodType {
  let base: z.ZodType;
  if (meta.kind === 'choice') {
    const values = (meta.options ?? []).map((o) => o.value);
    if (values.length === 0) throw new Error(`choice input ${meta.name} has no options`);
    base = z.enum(values as [string, ...string[]]);
  } else {
    let n = z.number({ error: `${meta.label} must be a number` });
    if (meta.kind === 'integer') n = n.int({ error: `${meta.label} must be a whole number` });
    if (meta.min !== undefined)
      n = n.min(meta.min, { error: `${meta.label} must be at least ${meta.min} ${meta.unit}`.trim() });
    if (meta.max !== undefined)
      n = n.max(meta.max, { error: `${meta.label} must be at most ${meta.max} ${meta.unit}`.trim() });
    base = n;
  }
  // JSON forms send null for an empty optional field. An optional field's `default` only prefills the form;
  // the calculator decides what an absent value means.
  if (meta.optional) return base.nullish().transform((v) => v ?? undefined);
  if (meta.default !== undefined) return (base as z.ZodNumber).default(meta.default as never);
  return base;
}

/**
 * The inputs the chosen options leave in play, given the raw or parsed values: an input with `when` counts only
 * while its choice (or, when absent, the choice's default) has one of the listed values.
 */
export function activeInputs(inputs: InputMeta[], values: Record<string, unknown>): InputMeta[] {
  const byName = new Map(inputs.map((m) => [m.name, m]));
  const chosen = (name: string) => {
    const v = values[name];
    return v === undefined || v === null || v === '' ? byName.get(name)?.default : v;
  };
  return inputs.filter((m) => !m.when || m.when.is.some((v) => v === chosen(m.when!.input)));
}

function withoutHidden(inputs: InputMeta[], raw: unknown): unknown {
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return raw;
  const values = raw as Record<string, unknown>;
  const hidden = new Set(inputs.map((m) => m.name));
  for (const m of activeInputs(inputs, values)) hidden.delete(m.name);
  return Object.fromEntries(Object.entries(values).filter(([k]) => !hidden.has(k)));
}

export function objectSchema(inputs: InputMeta[]) {
  const shape: Record<string, z.ZodType> = {};
  for (const m of inputs) {
    // A hidden input is absent when parsed, so it must be able to be: optional, or with a default.
    if (m.when && !m.optional && m.default === undefined)
      throw new Error(`input ${m.name} has a condition, so it needs a default or optional: true`);
    shape[m.name] = fieldSchema(m);
  }
  const object = z.object(shape);
  if (!inputs.some((m) => m.when)) return object;
  // Hidden inputs are dropped before parsing (a stale hidden value cannot fail the form) and after it (a hidden
  // input's default cannot reach the result or the saved inputs).
  return z.preprocess((raw) => withoutHidden(inputs, raw), object).transform((v) => withoutHidden(inputs, v));
}

/** Labels for the shared water choice. */
export const WATER_OPTIONS = [
  { value: 'fresh', label: 'Fresh water' },
  { value: 'sea', label: 'Seawater (S_A 35.165 g/kg)' },
];
