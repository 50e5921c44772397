import { stringify } from 'yaml';
import { getCollection } from 'astro:content';
import type { GuideFile } from './content';

/**
 * The guides as MDX sources, from the built content collection (a release has no `src/`). The collection keeps
 * each file's raw text, front matter included; should a future Astro keep only the body, the front matter is
 * written back from the parsed data.
 */
export async function guideFiles(): Promise<GuideFile[]> {
  const entries = await getCollection('guides');
  return entries
    .map((e) => {
      const raw = e.body ?? '';
      const content = raw.startsWith('---')
        ? raw
        : `---\n${stringify({ ...e.data, reviewedOn: e.data.reviewedOn.toISOString().slice(0, 10) }).trimEnd()}\n---\n${raw}`;
      return {
        path: `guides/${e.data.subsystem}/${e.id}.mdx`,
        title: e.data.title,
        subsystem: e.data.subsystem,
        content,
      };
    })
    .sort((a, b) => a.path.localeCompare(b.path));
}
