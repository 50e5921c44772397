// Starts the built server (npm run build first) on a fresh database with the demo seeded, for the browser tests.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

let server: ChildProcess | undefined;

export default async function setup(project: TestProject) {
  if (!existsSync('dist/prepare/prepare.mjs')) throw new Error('Build first: npm run build');
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-e2e-'));
  const port = String(4500 + Math.floor(Math.random() * 400));
  // Spawned as node directly so teardown can stop it by its own PID.
  server = spawn(process.execPath, ['scripts/start.mjs'], {
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: port,
      WAKEBOOK_DB: join(dir, 'e2e.db'),
      WAKEBOOK_UPLOADS: join(dir, 'uploads'),
      WAKEBOOK_DEMO: '1',
      NODE_ENV: 'production',
      ASTRO_TELEMETRY_DISABLED: '1',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error('the server did not answer /api/health within 30 s');
    await new Promise((r) => setTimeout(r, 200));
  }
  project.provide('e2eBaseUrl', base);
  project.provide('e2eDbPath', join(dir, 'e2e.db'));
  return () => {
    server?.kill('SIGTERM');
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    e2eBaseUrl: string;
    /** The server's SQLite file, for tests that must set up a state no route creates (an older engine's result). */
    e2eDbPath: string;
  }
}
