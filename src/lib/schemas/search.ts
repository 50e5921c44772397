import { z } from 'zod';
import { SEARCH_TYPES } from '../search-types';

export * from '../search-types';

export const MAX_QUERY_LENGTH = 500;
export const MAX_OFFSET = 200;

const slug = z
  .string()
  .trim()
  .max(64)
  .regex(/^[a-z0-9-]*$/, 'Use a subsystem slug.');

/** GET /api/search. `season` is a season's id or its name ("2025–26"). */
export const searchQuerySchema = z.object({
  q: z.string().max(MAX_QUERY_LENGTH, `Keep a search under ${MAX_QUERY_LENGTH} characters.`).default(''),
  type: z.enum(SEARCH_TYPES).optional().or(z.literal('')),
  subsystem: slug.optional(),
  season: z.string().trim().max(64).optional(),
  limit: z.coerce.number().int().min(1).max(50).default(10),
  offset: z.coerce.number().int().min(0).max(MAX_OFFSET).default(0),
});
export type SearchQuery = z.infer<typeof searchQuerySchema>;
