import { defineCollection, z } from 'astro:content';
import { glob } from 'astro/loaders';

// Astro 5 bundles zod 3: this file uses `z` from astro:content, the app uses zod 4 elsewhere.
export const GUIDE_SUBSYSTEMS = ['hull', 'propulsion', 'cooling', 'battery', 'solar', 'steering', 'telemetry', 'general'] as const;

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

const guides = defineCollection({
  // A guide's slug is its file name, so links survive moving a guide to another subsystem folder.
  loader: glob({
    pattern: '**/*.mdx',
    base: './src/content/guides',
    generateId: ({ entry }) => entry.split('/').pop()!.replace(/\.mdx$/, ''),
  }),
  schema: guideSchema,
});

export const collections = { guides };
