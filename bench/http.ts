// Foundation benchmark: the plain Node http ceiling for a page of the same size, GET /api/me signed in and the
// signed-in home page, all in one run on loopback.
import { fork, type ChildProcess } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadTool, runLoad, type LoadResult } from './load';
import { startBuiltServer, signInCookie } from './server';

export default async function benchHttp(opts: { seconds?: number } = {}): Promise<object[]> {
  const seconds = opts.seconds ?? 8;
  // First start seeds the demo; the measured cold start is a restart on the same files, as in production.
  const seeding = await startBuiltServer(4620);
  await seeding.stop();
  const server = await startBuiltServer(4620, {}, seeding.dir);
  const out: object[] = [];
  try {
    const cookie = await signInCookie(server.base, 'member@wakebook.test');
    const home = await (await fetch(`${server.base}/`, { headers: { cookie } })).text();
    // The ceiling: plain node:http answering a page of the same size as the signed-in home page.
    const body = Buffer.from(home);
    const bodyFile = join(mkdtempSync(join(tmpdir(), 'wakebook-ceiling-')), 'page.html');
    writeFileSync(bodyFile, body);
    const plain = await startPlainServer(4621, bodyFile);
    try {
      const ceiling = await runLoad({ name: 'http.ceiling.plain-node', url: 'http://127.0.0.1:4621/', seconds });
      out.push(report(ceiling, ceiling, { bytes: body.length }));
      // Calibration: the same plain server spending 2 ms of CPU per answer (about a page render here).
      const busy = await startPlainServer(4622, bodyFile, 2);
      try {
        out.push(
          report(
            await runLoad({ name: 'http.calibration.plain-node-2ms-work', url: 'http://127.0.0.1:4622/', seconds }),
            ceiling,
          ),
        );
      } finally {
        busy.kill();
      }
      // With the response cache (the default): repeated reads are answered before Astro renders anything.
      out.push(...(await readsAndMixed(server.base, cookie, ceiling, seconds, '')));
      out.push({ name: 'server.cold-start', n: 1, p50_ms: round(server.startMs), p99_ms: round(server.startMs) });
      out.push({ name: 'server.rss-after-load', n: 1, p50_ms: 0, p99_ms: 0, rss_mb: round(server.rssMb()) });
      await server.stop();
      // The same reads with the cache turned off: what every first view after a write costs.
      const uncached = await startBuiltServer(4620, { WAKEBOOK_RESPONSE_CACHE_MB: '0' }, seeding.dir);
      try {
        const uncachedCookie = await signInCookie(uncached.base, 'member@wakebook.test');
        out.push(...(await readsAndMixed(uncached.base, uncachedCookie, ceiling, seconds, '.render')));
        out.push({ name: 'server.rss-after-load.render', n: 1, p50_ms: 0, p99_ms: 0, rss_mb: round(uncached.rssMb()) });
      } finally {
        await uncached.stop();
      }
    } finally {
      plain.kill();
    }
  } finally {
    await server.stop();
  }
  return out;
}

async function readsAndMixed(
  base: string,
  cookie: string,
  ceiling: LoadResult,
  seconds: number,
  suffix: string,
): Promise<object[]> {
  const out: object[] = [];
  const run = async (name: string, path: string, wrkScript?: string) =>
    report(
      await runLoad({ name: name + suffix, url: `${base}${path}`, headers: { cookie }, seconds, wrkScript }),
      ceiling,
    );
  out.push(await run('http.api.me', '/api/me'));
  out.push(await run('http.page.home', '/'));
  out.push(await run('http.page.record', '/records/demo-rec-2526-two-propellers'));
  out.push(await run('http.api.record-read', '/api/records/demo-rec-2526-two-propellers'));
  if (loadTool() === 'wrk') {
    // 35 % page views, 20 % searches, 35 % JSON reads, 10 % writes (comments), all signed in.
    out.push(await run('http.mixed', '/', new URL('./mixed.lua', import.meta.url).pathname));
  }
  return out;
}

/** plain-server.mjs in its own process (wrk runs synchronously here and would starve a server in this one). */
async function startPlainServer(port: number, bodyFile: string, workMs?: number): Promise<ChildProcess> {
  const args = [String(port), bodyFile, ...(workMs ? [String(workMs)] : [])];
  const child = fork(new URL('./plain-server.mjs', import.meta.url).pathname, args, {
    stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
  });
  await new Promise<void>((r) => child.once('message', () => r()));
  return child;
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}

function report(r: LoadResult, ceiling: LoadResult, extra: object = {}) {
  return {
    name: r.name,
    n: r.n,
    p50_ms: round(r.p50_ms),
    p99_ms: round(r.p99_ms),
    ops_per_s: round(r.ops_per_s),
    pct_of_ceiling: round((100 * r.ops_per_s) / ceiling.ops_per_s),
    errors: r.errors,
    tool: r.tool,
    connections: r.connections,
    seconds: r.seconds,
    ...extra,
  };
}
