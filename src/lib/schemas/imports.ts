import { z } from 'zod';
import { RECORD_KINDS } from '../domain';

/** The text fields sent beside the files of an import (multipart form fields are strings; blank means not given). */
export const importFieldsSchema = z.object({
  subsystem: z
    .string({ error: 'Choose a subsystem.' })
    .trim()
    .min(1, 'Choose a subsystem.')
    .max(64)
    .regex(/^[a-z0-9-]+$/, 'Use a subsystem slug.'),
  kind: z.enum(RECORD_KINDS, { error: 'Choose decision or lesson.' }),
  seasonId: z
    .string()
    .trim()
    .max(64)
    .regex(/^[A-Za-z0-9_-]*$/, 'Not a valid id.')
    .optional()
    .transform((v) => v || undefined),
});
