// Vitest has no Astro content store, so `astro:content` is replaced here by a loader over the same files with
// the same schema and slug rule as src/content.config.ts. Rendering MDX is left to the build and the e2e tests.
import { vi } from 'vitest';

vi.mock('astro:content', async () => {
  const fs = await import('node:fs');
  const path = await import('node:path');
  const yaml = await import('yaml');
  const { guideSchema, guideIdFromPath } = await import('../../src/lib/guide-schema');
  const base = 'src/content/guides';
  const entries = fs
    .readdirSync(base, { recursive: true })
    .map(String)
    .filter((f) => f.endsWith('.mdx'))
    .map((file) => {
      const text = fs.readFileSync(path.join(base, file), 'utf8');
      const front = /^---\n([\s\S]*?)\n---/.exec(text)?.[1] ?? '';
      return {
        id: guideIdFromPath(file),
        collection: 'guides',
        data: guideSchema.parse(yaml.parse(front)),
        body: text,
      };
    });
  return {
    getCollection: (name: string, filter?: (e: (typeof entries)[number]) => boolean) =>
      Promise.resolve(name === 'guides' ? entries.filter((e) => !filter || filter(e)) : []),
    getEntry: (name: string, id: string) =>
      Promise.resolve(name === 'guides' ? entries.find((e) => e.id === id) : undefined),
    render: () => Promise.reject(new Error('render() is not available in unit tests')),
  };
});
