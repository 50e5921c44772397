// Server CPU time per answer, per URL: steadier than requests per second on a shared machine.
//   npx tsx bench/cpu-per-answer.ts [--start path/to/start.mjs] [--runs 5] [--n 200] [--304]
// Starts the built server (response cache off; with --304 on, and every request revalidates with If-None-Match),
// signs in as a member, warms each URL up, then for each run sends n requests at 4 at a time and divides the
// server's CPU time (/proc/<pid>/stat) by n. Prints the median and the spread of the runs and the load average.
import { spawn } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { cpuMs } from './load';
import { signInCookie, startFlags } from './server';

const args = process.argv.slice(2);
const opt = (name: string, fallback: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : fallback;
};
const start = opt('start', 'scripts/start.mjs');
const runs = Number(opt('runs', '5'));
const n = Number(opt('n', '200'));
const revalidate = args.includes('--304');
const port = Number(opt('port', '4690'));
const urls = opt(
  'urls',
  [
    '/records/demo-rec-2526-two-propellers',
    '/',
    '/api/records/demo-rec-2526-two-propellers',
    '/subsystems/battery',
    '/search?q=coolant',
  ].join(','),
).split(',');

const dir = mkdtempSync(join(tmpdir(), 'wakebook-cpu-'));
const child = spawn(process.execPath, [...startFlags(), start], {
  env: {
    ...process.env,
    HOST: '127.0.0.1',
    PORT: String(port),
    WAKEBOOK_DB: join(dir, 'db.sqlite'),
    WAKEBOOK_UPLOADS: join(dir, 'uploads'),
    WAKEBOOK_DEMO: '1',
    NODE_ENV: 'production',
    ...(revalidate ? {} : { WAKEBOOK_RESPONSE_CACHE_MB: '0' }),
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
  if (i > 3000) throw new Error('server did not start');
  await new Promise((r) => setTimeout(r, 20));
}
const pid = child.pid!;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

try {
  const cookie = await signInCookie(base, 'member@wakebook.test');
  for (const url of urls) {
    const headers: Record<string, string> = { cookie };
    const first = await fetch(base + url, { headers });
    if (!first.ok) throw new Error(`${url}: ${first.status}`);
    const bytes = (await first.arrayBuffer()).byteLength;
    if (revalidate) headers['if-none-match'] = first.headers.get('etag') ?? '';
    const batch = async (count: number) => {
      let next = 0;
      const worker = async () => {
        while (next++ < count) {
          const res = await fetch(base + url, { headers });
          await res.arrayBuffer();
          if (res.status !== (revalidate ? 304 : 200)) throw new Error(`${url}: ${res.status}`);
        }
      };
      await Promise.all([worker(), worker(), worker(), worker()]);
    };
    await batch(Math.min(n, 100));
    const perRun: number[] = [];
    for (let r = 0; r < runs; r++) {
      const c0 = cpuMs(pid);
      await batch(n);
      perRun.push((cpuMs(pid) - c0) / n);
    }
    const sorted = [...perRun].sort((a, b) => a - b);
    console.log(
      JSON.stringify({
        url,
        status: revalidate ? 304 : 200,
        bytes,
        cpu_ms_median: +median(perRun).toFixed(3),
        cpu_ms_min: +sorted[0].toFixed(3),
        cpu_ms_max: +sorted[sorted.length - 1].toFixed(3),
        load_avg_1m: +loadavg()[0].toFixed(2),
      }),
    );
  }
  const status = (await import('node:fs')).readFileSync(`/proc/${pid}/status`, 'utf8');
  console.log(JSON.stringify({ rss_mb: Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024 }));
} finally {
  child.kill('SIGTERM');
}
