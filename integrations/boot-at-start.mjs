// Makes the built server validate its settings, apply migrations and seed the demo *before* it listens,
// so a bad setting stops `node dist/server/entry.mjs` with a clear message instead of failing on the first
// request. Astro 5 loads middleware lazily; this imports it up front and calls the boot function it registers
// (src/middleware.ts sets globalThis.__wakebookBoot). See docs/decisions/003-migrations-at-start.md.
import { readFile, writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';

const MARK = '/* wakebook:boot-at-start */';

export default function bootAtStart() {
  let serverDir;
  return {
    name: 'wakebook:boot-at-start',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        const entry = fileURLToPath(new URL('entry.mjs', serverDir));
        const source = await readFile(entry, 'utf8');
        if (source.includes(MARK)) return;
        const prelude = `${MARK}
try {
  await import('./_astro-internal_middleware.mjs');
  await globalThis.__wakebookBoot?.();
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}
`;
        // Imports stay first; the prelude runs before the adapter starts listening.
        const at = source.indexOf('\nconst ');
        // React and other libraries pick their development or production build from NODE_ENV when first
        // imported; the built server is production unless told otherwise, so set it before any other import.
        const envModule = fileURLToPath(new URL('wakebook-production-env.mjs', serverDir));
        await writeFile(envModule, "process.env.NODE_ENV ??= 'production';\n");
        await writeFile(entry, `import './wakebook-production-env.mjs';\n` + source.slice(0, at + 1) + prelude + source.slice(at + 1));
      },
    },
  };
}
