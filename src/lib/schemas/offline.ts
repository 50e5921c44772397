import { z } from 'zod';

/** GET /api/offline/pack: `since` is a `version` this API handed out earlier (`<milliseconds>-<scope hash>`). */
export const offlinePackQuerySchema = z.object({
  since: z
    .string()
    .regex(/^\d{1,15}-[0-9a-f]{8}$/, 'Use a version this API gave you, e.g. 1767225600000-1a2b3c4d.')
    .optional(),
});
