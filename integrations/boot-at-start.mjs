// Gives the built server its own entry (integrations/server-entry.mjs): it validates settings, applies
// migrations and seeds the demo *before* it listens, so a bad setting stops `node dist/server/entry.mjs` with a
// clear message instead of failing on the first request, and it serves the built assets from memory.
// Astro's own entry (the @astrojs/node handler in middleware mode) is kept beside it as app.mjs.
// See docs/decisions/003-migrations-at-start.md and 008-reliability-security-speed.md.
import { copyFile, readFile, rename, writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';

const MARK = "// The built server's entry";

export default function bootAtStart() {
  let serverDir;
  return {
    name: 'wakebook:boot-at-start',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        const at = (name) => fileURLToPath(new URL(name, serverDir));
        if ((await readFile(at('entry.mjs'), 'utf8')).startsWith(MARK)) return;
        await rename(at('entry.mjs'), at('app.mjs'));
        // React and other libraries pick their development or production build from NODE_ENV when first
        // imported; the built server is production unless told otherwise, so set it before any other import.
        // V8 grows the heap by up to four times what survived a collection; capped at twice, the server under the
        // mixed bench kept about 200 MB instead of about 250 MB of memory at the same speed (decision 008).
        await writeFile(
          at('wakebook-production-env.mjs'),
          "import v8 from 'node:v8';\nprocess.env.NODE_ENV ??= 'production';\nv8.setFlagsFromString('--heap-growing-percent=100');\n",
        );
        await copyFile(new URL('./static-assets.mjs', import.meta.url), at('wakebook-static-assets.mjs'));
        await copyFile(new URL('./request-queue.mjs', import.meta.url), at('wakebook-request-queue.mjs'));
        await copyFile(new URL('./server-entry.mjs', import.meta.url), at('entry.mjs'));
      },
    },
  };
}
