// Starts the built server on a fresh demo database for a benchmark and stops it by its own PID.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface RunningServer {
  base: string;
  child: ChildProcess;
  startMs: number;
  stop(): Promise<void>;
  rssMb(): number;
}

/**
 * The V8 flags that `npm start` gives node (package.json's start script, e.g. `--max-old-space-size=512`): the
 * benchmarks measure the server as it is started in production, not a bare `node scripts/start.mjs`.
 */
export function startFlags(): string[] {
  const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { scripts: { start: string } };
  const words = pkg.scripts.start.split(/\s+/);
  return words.slice(words.indexOf('node') + 1, words.indexOf('scripts/start.mjs')).filter((w) => w.startsWith('--'));
}

export async function startBuiltServer(
  port: number,
  env: Record<string, string> = {},
  reuseDir?: string,
): Promise<RunningServer & { dir: string }> {
  if (!existsSync('dist/prepare/prepare.mjs')) throw new Error('Build first: npm run build');
  const dir = reuseDir ?? mkdtempSync(join(tmpdir(), 'wakebook-bench-'));
  const t0 = performance.now();
  const child = spawn(process.execPath, [...startFlags(), 'scripts/start.mjs'], {
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(port),
      WAKEBOOK_DB: join(dir, 'bench.db'),
      WAKEBOOK_UPLOADS: join(dir, 'uploads'),
      WAKEBOOK_DEMO: '1',
      NODE_ENV: 'production',
      ...env,
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const base = `http://127.0.0.1:${port}`;
  for (let i = 0; ; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) break;
    } catch {
      // not yet
    }
    if (i > 1500) throw new Error('server did not start');
    // Polled often: start to first answer is one of the figures.
    await new Promise((r) => setTimeout(r, 10));
  }
  const startMs = performance.now() - t0;
  return {
    dir,
    base,
    child,
    startMs,
    rssMb() {
      try {
        const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
        return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
      } catch {
        return NaN;
      }
    },
    async stop() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
    },
  };
}

export async function signInCookie(base: string, email: string, password = 'wakebook-demo'): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('wakebook_session='));
  if (!cookie) throw new Error('no session cookie');
  return cookie.split(';')[0];
}
