// Memory after a multi-person load: start built server, add bench people, many reads over many URLs, then report.
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { addBenchPeople, benchReadPaths } from '../bench/people';
import { signInCookie } from '../bench/server';

const dir = mkdtempSync(join(tmpdir(), 'wakebook-mem-'));
const port = 4693;
const extra = (process.env.NODEARGS ?? '').split(' ').filter(Boolean);
async function start() {
  const child = spawn(process.execPath, [...extra, 'scripts/start.mjs'], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), WAKEBOOK_DB: join(dir, 'db.sqlite'), WAKEBOOK_UPLOADS: join(dir, 'up'), WAKEBOOK_DEMO: '1', NODE_ENV: 'production' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  for (let i = 0; ; i++) {
    try { if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) break; } catch {}
    if (i > 3000) throw new Error('no start');
    await new Promise((r) => setTimeout(r, 20));
  }
  return child;
}
const rss = (pid: number) => { const s = readFileSync(`/proc/${pid}/status`, 'utf8'); return Number(/VmRSS:\s+(\d+)/.exec(s)![1]) / 1024; };
let child = await start();
await new Promise((r) => { child.once('exit', r); child.kill('SIGTERM'); });
const emails = addBenchPeople(join(dir, 'db.sqlite'));
const paths = benchReadPaths(join(dir, 'db.sqlite'));
child = await start();
const base = `http://127.0.0.1:${port}`;
console.log('rss at start', rss(child.pid!).toFixed(0), 'paths', paths.length, 'people', emails.length);
const cookies = await Promise.all(emails.slice(0, 23).map((e) => signInCookie(base, e)));
let n = 0;
const t0 = Date.now();
const worker = async (w: number) => {
  for (let round = 0; round < 3; round++)
    for (let i = 0; i < paths.length; i++) {
      const c = cookies[(w * 7 + i + round) % cookies.length];
      const res = await fetch(base + paths[(i + w * 5) % paths.length], { headers: { cookie: c } });
      await res.arrayBuffer(); n++;
    }
};
await Promise.all(Array.from({ length: 8 }, (_, w) => worker(w)));
console.log('requests', n, 'seconds', ((Date.now() - t0) / 1000).toFixed(1), 'rss after load', rss(child.pid!).toFixed(0));
if (process.env.SNAP) { child.kill('SIGUSR2'); await new Promise((r) => setTimeout(r, 15000)); }
await new Promise((r) => setTimeout(r, 3000));
console.log('rss 3 s later', rss(child.pid!).toFixed(0));
child.kill('SIGTERM');
