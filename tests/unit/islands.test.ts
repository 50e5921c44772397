// Islands are mounted by src/scripts/islands.ts from <Island name="…"> (docs/decisions/020): pages carry no inline
// script, so the content security policy allows only our own files. An Astro `client:*` directive would bring
// back Astro's inline loader script, which that policy blocks (the island would silently never load).
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? files(join(dir, e.name)) : /\.(astro|mdx)$/.test(e.name) ? [join(dir, e.name)] : [],
  );
}
const sources = files('src').map((path) => ({ path, text: readFileSync(path, 'utf8') }));
const registry = readFileSync('src/scripts/islands.ts', 'utf8');
const registered = new Set(
  [...registry.matchAll(/^\s+'([\w/]+)': \(\) => import\('\.\.\/islands\/([\w/]+)'\)/gm)].map((m) => m[1]),
);

describe('islands', () => {
  it('no page or component uses an Astro client directive or an inline script', () => {
    const offenders = sources
      .filter(({ text }) => /\sclient:(load|idle|visible|media|only)\b/.test(text) || /\sis:inline\b/.test(text))
      .map(({ path }) => path);
    expect(offenders).toEqual([]);
  });

  it('every <Island name> is in the registry, and each registry name is the island’s own path', () => {
    expect(registered.size).toBeGreaterThan(20);
    for (const m of registry.matchAll(/^\s+'([\w/]+)': \(\) => import\('\.\.\/islands\/([\w/]+)'\)/gm))
      expect(m[1]).toBe(m[2]);
    const used = sources.flatMap(({ path, text }) =>
      [...text.matchAll(/<Island\s[^>]*?name="([^"]+)"/g)].map((m) => ({ path, name: m[1] })),
    );
    expect(used.length).toBeGreaterThan(20);
    expect(used.filter((u) => !registered.has(u.name))).toEqual([]);
  });
});
