// Vitest has no Astro content store, so `astro:content` is replaced here by a loader over the same files with
// the same schema and slug rule as src/content.config.ts. Rendering MDX is left to the build and the e2e tests.
import { vi } from 'vitest';

vi.mock('astro:content', async () => {
  const { readdirSync, readFileSync } = await import('node:fs');
  const { join } = await import('node:path');
  const { parse } = await import('yaml');
  const { guideSchema, guideIdFromPath } = await import('../../src/lib/guide-schema');
  const base = 'src/content/guides';
  const entries = readdirSync(base, { recursive: true })
    .map(String)
    .filter((f) => f.endsWith('.mdx'))
    .map((file) => {
      const text = readFileSync(join(base, file), 'utf8');
      const front = /^---\n([\s\S]*?)\n---/.exec(text)?.[1] ?? '';
      return {
        id: guideIdFromPath(file),
        collection: 'guides',
        data: guideSchema.parse(parse(front)),
        body: text,
        filePath: join(base, file),
      };
    });
  return {
    getCollection: async (name: string, filter?: (e: (typeof entries)[number]) => boolean) =>
      name === 'guides' ? entries.filter((e) => !filter || filter(e)) : [],
    getEntry: async (name: string, id: string) => (name === 'guides' ? entries.find((e) => e.id === id) : undefined),
    render: async () => {
      throw new Error('render() is not available in unit tests');
    },
  };
});
