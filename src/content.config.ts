import { defineCollection } from 'astro:content';
import { glob } from 'astro/loaders';
import { guideSchema, guideIdFromPath } from './lib/guide-schema';

const guides = defineCollection({
  loader: glob({
    pattern: '**/*.mdx',
    base: './src/content/guides',
    generateId: ({ entry }) => guideIdFromPath(entry),
  }),
  schema: guideSchema,
});

export const collections = { guides };
