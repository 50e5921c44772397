// HTTP load on loopback: wrk from Debian's packages when present (it keeps a plain Node server busy on two
// cores, which autocannon alone could not), else autocannon. Every run is bounded in time.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface LoadResult {
  name: string;
  n: number;
  p50_ms: number;
  p99_ms: number;
  ops_per_s: number;
  errors: number;
  tool: 'wrk' | 'autocannon';
  connections: number;
  seconds: number;
}

export interface LoadOptions {
  name: string;
  url: string;
  headers?: Record<string, string>;
  connections?: number;
  seconds?: number;
  /** A wrk Lua script for mixed or non-GET loads. */
  wrkScript?: string;
  /** Seconds of the same load, not measured, first: loads modules and warms the JIT (cold start is measured apart). */
  warmup?: number;
}

const WRK = ['/usr/bin/wrk', '/usr/local/bin/wrk'].find((p) => existsSync(p));

export function loadTool(): 'wrk' | 'autocannon' {
  return WRK ? 'wrk' : 'autocannon';
}

function toMs(value: string, unit: string): number {
  const v = Number(value);
  return unit === 'us' ? v / 1000 : unit === 's' ? v * 1000 : unit === 'm' ? v * 60_000 : v;
}

export async function runLoad(o: LoadOptions): Promise<LoadResult> {
  const connections = o.connections ?? 50;
  const seconds = o.seconds ?? 8;
  const warmup = o.warmup ?? 2;
  if (WRK) {
    const args = (d: number) => {
      const a = ['-t2', `-c${connections}`, `-d${d}s`, '--latency', '--timeout', '5s'];
      for (const [k, v] of Object.entries(o.headers ?? {})) a.push('-H', `${k}: ${v}`);
      if (o.wrkScript) a.push('-s', o.wrkScript);
      a.push(o.url);
      return a;
    };
    if (warmup > 0) spawnSync(WRK, args(warmup), { encoding: 'utf8', timeout: (warmup + 30) * 1000 });
    const out = spawnSync(WRK, args(seconds), { encoding: 'utf8', timeout: (seconds + 30) * 1000 });
    const text = out.stdout ?? '';
    const pct = (p: string) => {
      const m = new RegExp(`^\\s*${p}%\\s+([\\d.]+)(us|ms|s|m)\\s*$`, 'm').exec(text);
      return m ? toMs(m[1], m[2]) : NaN;
    };
    const rps = Number(/Requests\/sec:\s+([\d.]+)/.exec(text)?.[1] ?? NaN);
    const n = Number(/(\d+) requests in/.exec(text)?.[1] ?? 0);
    const non2xx = Number(/Non-2xx or 3xx responses:\s+(\d+)/.exec(text)?.[1] ?? 0);
    const sock = /Socket errors: connect (\d+), read (\d+), write (\d+), timeout (\d+)/.exec(text);
    const errors = non2xx + (sock ? sock.slice(1).reduce((a, b) => a + Number(b), 0) : 0);
    return {
      name: o.name,
      n,
      p50_ms: pct('50'),
      p99_ms: pct('99'),
      ops_per_s: rps,
      errors,
      tool: 'wrk',
      connections,
      seconds,
    };
  }
  const { default: autocannon } = await import('autocannon');
  if (warmup > 0)
    await autocannon({ url: o.url, connections, duration: warmup, headers: o.headers, workers: 2 } as never);
  const r = await autocannon({ url: o.url, connections, duration: seconds, headers: o.headers, workers: 2 } as never);
  return {
    name: o.name,
    n: r.requests.total,
    p50_ms: r.latency.p50,
    p99_ms: r.latency.p99,
    ops_per_s: r.requests.average,
    errors: r.errors + r.non2xx,
    tool: 'autocannon',
    connections,
    seconds,
  };
}
