import { z } from 'zod';
import { idSchema as id, slugSchema as slug } from './keys';
import { typedLine, typedText } from './text';

/** Raw calculator inputs: a flat object of numbers and short strings; each calculator's own schema checks the rest. */
export const rawInputsSchema = z
  .record(z.string().max(64), z.union([z.number(), z.string().max(64), z.boolean(), z.null()]))
  .refine((o) => Object.keys(o).length <= 64, 'Too many inputs.');

export const runCalculatorInputSchema = z.object({ inputs: rawInputsSchema.default({}) });

export const calculationInputSchema = z.object({
  kind: z.string().trim().min(1).max(64),
  title: typedLine().trim().min(3, 'Give the calculation a title of at least 3 characters.').max(160),
  subsystem: slug,
  seasonId: id.optional(),
  notes: typedText().max(20_000).default(''),
  inputs: rawInputsSchema,
});
export type CalculationInput = z.infer<typeof calculationInputSchema>;

/** Rename, re-note or move a saved calculation; its inputs and results never change after saving. */
export const calculationPatchSchema = z
  .strictObject({
    title: calculationInputSchema.shape.title.optional(),
    notes: typedText().max(20_000).optional(),
    subsystem: slug.optional(),
  })
  .refine((p) => p.title !== undefined || p.notes !== undefined || p.subsystem !== undefined, {
    message: 'Change at least one of title, notes or subsystem.',
  });
export type CalculationPatch = z.infer<typeof calculationPatchSchema>;

export const calculationListQuerySchema = z.object({
  subsystem: slug.optional().or(z.literal('')),
  season: id.optional().or(z.literal('')),
  kind: z.string().max(64).optional().or(z.literal('')),
  limit: z.coerce.number().int().min(1).max(100).default(25),
  cursor: z.string().max(100).optional(),
});

export const compareQuerySchema = z.object({ a: id, b: id });
