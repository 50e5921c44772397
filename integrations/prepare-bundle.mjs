// Bundles src/lib/server/prepare.ts into dist/prepare/ after `astro build`, so that `npm start` (scripts/start.mjs)
// can validate settings, migrate and seed *before* it loads the Astro app and listens. Packages stay external (they
// are installed beside dist/ in production); esbuild is the bundler Vite itself uses.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

export default function prepareBundle() {
  let outDir;
  return {
    name: 'wakebook:prepare-bundle',
    hooks: {
      'astro:config:done': ({ config }) => {
        outDir = config.outDir;
      },
      'astro:build:done': async ({ logger }) => {
        await build({
          entryPoints: { prepare: fileURLToPath(new URL('../src/lib/server/prepare.ts', import.meta.url)) },
          outdir: fileURLToPath(new URL('prepare/', outDir)),
          outExtension: { '.js': '.mjs' },
          bundle: true,
          splitting: true,
          format: 'esm',
          platform: 'node',
          target: 'node20',
          packages: 'external',
          define: {
            'import.meta.env.MODE': '"production"',
            'import.meta.env.PROD': 'true',
            'import.meta.env.DEV': 'false',
          },
          logLevel: 'warning',
        });
        logger.info('dist/prepare/prepare.mjs written');
      },
    },
  };
}
