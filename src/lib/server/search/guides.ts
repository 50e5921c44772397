// Guides for the search index: their front matter and MDX turned into plain text. The built server reads them from
// the content collection. Vitest runs without Astro's content store (it exists only after `astro build`, `astro
// dev` or `astro sync`), so there, and only when the collection comes back empty, the same MDX files are read
// from disk so tests search the same guides.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { getCollection } from 'astro:content';
import { guideIdFromPath, guideSchema } from '../../guide-schema';
import type { GuideDoc } from './engine';

/** MDX source → readable text: no imports, components, link targets or Markdown punctuation. */
export function mdxToText(source: string): string {
  return source
    .replace(/^(import|export)\s.*$/gm, '')
    .replace(/<[A-Za-z][^>]*\/>/g, ' ')
    .replace(/<\/?[A-Za-z][^>]*>/g, ' ')
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/^#{1,6}\s+/gm, '')
    .replace(/^>\s?/gm, '')
    .replace(/^\s*(?:[-*+]|\d+\.)\s+/gm, '')
    .replace(/^\s*\|?[\s:|-]+\|?\s*$/gm, '')
    .replace(/\|/g, ' ')
    .replace(/\*{1,3}|`+/g, '')
    .replace(/[ \t]+/g, ' ')
    .replace(/\n{3,}/g, '\n\n')
    .trim();
}

interface GuideSource {
  slug: string;
  title: string;
  subsystem: string;
  audience?: string;
  summary: string;
  tags?: string[];
  body: string;
}

export function toGuideDoc(g: GuideSource): GuideDoc {
  const tags = g.tags?.length ? `\n${g.tags.join(' ')}` : '';
  return {
    slug: g.slug,
    title: g.title,
    subsystem: g.subsystem,
    audience: g.audience ?? 'everyone',
    text: `${g.summary}\n\n${mdxToText(g.body)}${tags}`,
  };
}

function readGuideFiles(dir: string): GuideSource[] {
  const out: GuideSource[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (!entry.isFile() || !entry.name.endsWith('.mdx')) continue;
    const source = readFileSync(join(entry.parentPath, entry.name), 'utf8');
    const m = /^---\r?\n([\s\S]*?)\r?\n---\r?\n?([\s\S]*)$/.exec(source);
    if (!m) continue;
    // The collection's own schema, so a guide reads here exactly as `astro build` would accept it.
    const data = guideSchema.parse(parseYaml(m[1]));
    out.push({
      slug: guideIdFromPath(entry.name),
      title: data.title,
      subsystem: data.subsystem,
      audience: data.audience,
      summary: data.summary,
      tags: data.tags,
      body: m[2],
    });
  }
  return out;
}

export async function loadGuideDocs(): Promise<GuideDoc[]> {
  const entries = await getCollection('guides');
  let sources: GuideSource[] = entries.map((e) => ({ slug: e.id, ...e.data, body: e.body ?? '' }));
  const dir = resolve(process.cwd(), 'src/content/guides');
  if (sources.length === 0 && existsSync(dir)) sources = readGuideFiles(dir);
  return sources.map(toGuideDoc).sort((a, b) => a.slug.localeCompare(b.slug));
}

export function fingerprint(guides: GuideDoc[]): string {
  return createHash('sha256').update(JSON.stringify(guides)).digest('hex');
}
