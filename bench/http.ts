// HTTP benchmark, all in one run on loopback with wrk at 50 connections; every ratio is to the plain-node
// ceiling (a fixed page of the signed-in home page's size) measured in the same run:
//   1. the render path, response cache off: what every first view and every view after a write costs, with the
//      server's CPU time per answer (steadier than req/s on a shared machine);
//   2. cache on, >= 20 signed-in people over >= 40 URLs with 10 % writes (comments), each request picking a
//      person and a URL; then the same people's reads repeated with If-None-Match and nothing written (304s);
//   3. the server's RSS after those loads, and start to first answer on an already-seeded database.
import { fork, type ChildProcess } from 'node:child_process';
import { cpSync, mkdtempSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadTool, runLoad, type LoadOptions, type LoadResult } from './load';
import { addBenchPeople, benchReadPaths, benchWriteTargets } from './people';
import { startBuiltServer, signInCookie, type RunningServer } from './server';
import { writePeopleScript } from './wrk-script';

const RECORD = '/records/demo-rec-2526-two-propellers';
const RECORD_JSON = '/api/records/demo-rec-2526-two-propellers';

export default async function benchHttp(opts: { seconds?: number } = {}): Promise<object[]> {
  const seconds = opts.seconds ?? 8;
  // The first start seeds the demo; the extra people are written while no server runs. Each measured server then
  // starts on its own copy of that database (a restart on seeded files, as in production), so the writes of one
  // load never change what the next one reads.
  const seeding = await startBuiltServer(4620);
  await seeding.stop();
  const seeded = join(seeding.dir, 'bench.db');
  const emails = addBenchPeople(seeded);
  const paths = benchReadPaths(seeded);
  const writes = benchWriteTargets(seeded);
  const copyOf = () => {
    const dir = mkdtempSync(join(tmpdir(), 'wakebook-bench-'));
    cpSync(seeding.dir, dir, { recursive: true });
    return dir;
  };
  // Each row is also shown on stderr as soon as it is measured, so a failing later step loses nothing.
  const out: object[] = [];
  const push = out.push.bind(out);
  out.push = (...rows: object[]) => {
    for (const row of rows) console.error(JSON.stringify(row));
    return push(...rows);
  };

  // The render path: the cache off.
  const render = await startBuiltServer(4620, { WAKEBOOK_RESPONSE_CACHE_MB: '0' }, copyOf());
  let ceiling: LoadResult;
  let plain: ChildProcess | undefined;
  try {
    const cookie = await signInCookie(render.base, 'member@wakebook.test');
    const home = await (await fetch(`${render.base}/`, { headers: { cookie } })).text();
    const bodyFile = join(mkdtempSync(join(tmpdir(), 'wakebook-ceiling-')), 'page.html');
    writeFileSync(bodyFile, home);
    plain = await startPlainServer(4621, bodyFile);
    ceiling = await runLoad({ name: 'http.ceiling.plain-node', url: 'http://127.0.0.1:4621/', seconds });
    out.push(report(ceiling, ceiling, { bytes: Buffer.byteLength(home) }));
    // Calibration: the same plain server spending 2 ms of CPU per answer.
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
    out.push({ name: 'server.start-to-first-answer.render', ...startRow(render) });
    const run = async (name: string, path: string, extra: Partial<LoadOptions> = {}) =>
      report(
        await runLoad({
          name,
          url: `${render.base}${path}`,
          headers: { cookie },
          seconds,
          cpuPid: render.child.pid,
          ...extra,
        }),
        ceiling,
      );
    out.push(await run('http.render.page.record', RECORD));
    out.push(await run('http.render.page.home', '/'));
    out.push(await run('http.render.api.record-read', RECORD_JSON));
    out.push(await run('http.render.api.me', '/api/me'));
    if (loadTool() === 'wrk') {
      const cookies = await signInAll(render.base, emails);
      const script = writePeopleScript({ cookies, paths, writes, writePercent: 10 });
      const mixed = await runLoad({
        name: 'http.render.mixed-people',
        url: `${render.base}/`,
        seconds,
        wrkScript: script,
        cpuPid: render.child.pid,
      });
      out.push(report(mixed, ceiling, { people: cookies.length, urls: paths.length, write_percent: 10 }));
    }
  } finally {
    await render.stop();
  }

  // Cache on: many people, real writes dropping the cache, then revalidations.
  const server = await startBuiltServer(4620, {}, copyOf());
  try {
    out.push({ name: 'server.start-to-first-answer', ...startRow(server) });
    if (loadTool() === 'wrk') {
      const cookies = await signInAll(server.base, emails);
      const load = (name: string, script: string) =>
        runLoad({ name, url: `${server.base}/`, seconds, wrkScript: script, cpuPid: server.child.pid, warmup: 5 });
      const mixed = await load('http.mixed-people', writePeopleScript({ cookies, paths, writes, writePercent: 10 }));
      out.push(report(mixed, ceiling, { people: cookies.length, urls: paths.length, write_percent: 10 }));
      // Each person's tag for each path, read after the writes; from here on nothing is written.
      const tagged = await fetchEtags(server.base, cookies, paths);
      const repeats = await load('http.revalidate-304', writePeopleScript({ cookies, ...tagged }));
      out.push(
        report(repeats, ceiling, {
          people: cookies.length,
          urls: tagged.paths.length,
          checked_304: cookies.length * tagged.paths.length,
        }),
      );
    }
    out.push({ name: 'server.rss-after-load', n: 1, rss_mb: round(server.rssMb()), load_avg_1m: round(loadavg()[0]) });
  } finally {
    await server.stop();
    plain?.kill();
  }
  return out;
}

function startRow(s: RunningServer) {
  return { n: 1, p50_ms: round(s.startMs), p99_ms: round(s.startMs), load_avg_1m: round(loadavg()[0]) };
}

async function signInAll(base: string, emails: string[]): Promise<string[]> {
  const cookies: string[] = [];
  for (const email of emails) {
    // Once more when a pooled connection went stale during the previous load (see fetchAgain).
    cookies.push(await signInCookie(base, email).catch(() => signInCookie(base, email)));
  }
  return cookies;
}

/**
 * Every person's answer to every path that carries an ETag (the cacheable reads; /api/me, for one, is not): each
 * must be 200, and sending its tag back must answer 304, so that the revalidation load measures 304s and not
 * renders. Returns those paths and etags[person][path].
 */
async function fetchEtags(
  base: string,
  cookies: string[],
  allPaths: string[],
): Promise<{ paths: string[]; etags: string[][] }> {
  const tagOf = async (cookie: string, path: string) => {
    const res = await fetchAgain(`${base}${path}`, { cookie });
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`bench: ${path} answered ${res.status}`);
    return res.headers.get('etag');
  };
  const paths = (await Promise.all(allPaths.map(async (p) => ((await tagOf(cookies[0], p)) ? p : null)))).filter(
    (p): p is string => p !== null,
  );
  const etags: string[][] = [];
  for (const cookie of cookies) {
    const row = await Promise.all(
      paths.map(async (path) => {
        const tag = await tagOf(cookie, path);
        if (!tag) throw new Error(`bench: ${path} answered without an ETag`);
        const again = await fetchAgain(`${base}${path}`, { cookie, 'if-none-match': tag });
        await again.arrayBuffer();
        if (again.status !== 304) throw new Error(`bench: ${path} repeated answered ${again.status}, not 304`);
        return tag;
      }),
    );
    etags.push(row);
  }
  return { paths, etags };
}

/**
 * fetch, tried once more when the pooled connection had been closed by the server while idle (its keep-alive
 * timeout runs out during a wrk load).
 */
async function fetchAgain(url: string, headers: Record<string, string>): Promise<Response> {
  try {
    return await fetch(url, { headers });
  } catch {
    return fetch(url, { headers });
  }
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
    ...(r.cpu_ms_per_req !== undefined ? { cpu_ms_per_req: round(r.cpu_ms_per_req) } : {}),
    ...(r.bytes_per_req !== undefined ? { bytes_per_req: r.bytes_per_req } : {}),
    tool: r.tool,
    connections: r.connections,
    seconds: r.seconds,
    // The machine's one-minute load average as the row finished: on a shared machine, ratios to the ceiling mean
    // little once it is well above the number of cores (CPU ms per answer is the steadier figure).
    load_avg_1m: round(loadavg()[0]),
    ...extra,
  };
}
