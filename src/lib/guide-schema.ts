// The front matter every guide must have. Astro 5 validates content with its bundled zod 3 (`astro/zod`),
// so this schema uses it; the rest of the app uses zod 4. A wrong front matter fails `astro build` with the
// file and field named.
import { z } from 'astro/zod';

export const GUIDE_SUBSYSTEMS = [
  'hull',
  'propulsion',
  'cooling',
  'battery',
  'solar',
  'steering',
  'telemetry',
  'general',
] as const;

export const guideSchema = z
  .object({
    title: z.string().min(3).max(120),
    subsystem: z.enum(GUIDE_SUBSYSTEMS),
    summary: z.string().min(10).max(300),
    order: z.number().int().min(0).default(100),
    audience: z.enum(['everyone', 'new-members', 'leads']).default('everyone'),
    reviewedBy: z.string().min(2).max(120),
    reviewedOn: z.coerce.date(),
    calculations: z.array(z.string().regex(/^[a-z0-9-]+$/)).default([]),
    records: z.array(z.string().regex(/^[a-z0-9-]+$/)).default([]),
    tags: z.array(z.string().regex(/^[a-z0-9-]+$/)).default([]),
  })
  .strict();

/** A guide's slug is its file name, so links survive moving a guide to another subsystem folder. */
export function guideIdFromPath(entry: string): string {
  return entry
    .split('/')
    .pop()!
    .replace(/\.mdx$/, '');
}
