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

export function objectSchema(inputs: InputMeta[]) {
  const shape: Record<string, z.ZodType> = {};
  for (const m of inputs) shape[m.name] = fieldSchema(m);
  return z.object(shape);
}

/** Labels for the shared water choice. */
export const WATER_OPTIONS = [
  { value: 'fresh', label: 'Fresh water' },
  { value: 'sea', label: 'Seawater (S_A 35.165 g/kg)' },
];
