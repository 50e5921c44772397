// Writes dist/client/sw.js after `astro build` (the documented `astro:build:done` hook, like prepare-bundle.mjs):
//   1. esbuild bundles src/service-worker/sw.ts (Serwist's runtime and our routes) into one classic script;
//   2. @serwist/build's injectManifest lists what to precache — every hashed file under /_astro/ (scripts, styles,
//      fonts), the icons, the manifest and the offline page — with a revision for each file that is not hashed.
// The build id baked into the worker makes a new build fetch each person's offline pack whole again.
import { build } from 'esbuild';
import { injectManifest } from '@serwist/build';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export default function serviceWorker() {
  let clientDir;
  return {
    name: 'wakebook:service-worker',
    hooks: {
      'astro:config:done': ({ config }) => {
        clientDir = fileURLToPath(config.build.client);
      },
      'astro:build:done': async ({ logger }) => {
        const work = mkdtempSync(join(tmpdir(), 'wakebook-sw-'));
        try {
          const buildId = createHash('sha256').update(String(Date.now())).update(clientDir).digest('hex').slice(0, 12);
          const bundled = join(work, 'sw.js');
          await build({
            entryPoints: [fileURLToPath(new URL('../src/service-worker/sw.ts', import.meta.url))],
            outfile: bundled,
            bundle: true,
            format: 'iife',
            platform: 'browser',
            target: 'es2022',
            minify: true,
            define: { WAKEBOOK_BUILD: JSON.stringify(buildId), 'process.env.NODE_ENV': '"production"' },
            logLevel: 'warning',
          });
          const { count, size, warnings } = await injectManifest({
            swSrc: bundled,
            swDest: join(clientDir, 'sw.js'),
            globDirectory: clientDir,
            globPatterns: [
              '_astro/**/*.{js,css,woff2}',
              'icons/*.png',
              'favicon.svg',
              'logo.svg',
              'manifest.webmanifest',
            ],
            // Vite names these by their content: the name is the revision.
            dontCacheBustURLsMatching: /^_astro\//,
            // The offline page is rendered by the server; it changes only with a build.
            additionalPrecacheEntries: [{ url: '/offline', revision: buildId }],
            maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
          });
          for (const w of warnings) logger.warn(w);
          logger.info(`dist/client/sw.js written: ${count} files precached (${Math.round(size / 1024)} kB)`);
        } finally {
          rmSync(work, { recursive: true, force: true });
        }
      },
    },
  };
}
