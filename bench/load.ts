// HTTP load on loopback: wrk from Debian's packages when present (it keeps a plain Node server busy on two
// cores, which autocannon alone could not), else autocannon. Every run is bounded in time.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { z } from 'zod';

interface AutocannonOptions {
  url: string;
  connections: number;
  duration: number;
  headers?: Record<string, string>;
  workers: number;
}

/** The part of autocannon's result that a load reports. */
const AutocannonResult = z.object({
  requests: z.object({ total: z.number(), average: z.number() }),
  latency: z.object({ p50: z.number(), p99: z.number() }),
  errors: z.number(),
  non2xx: z.number(),
});

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
  /** Bytes read per answer (wrk only): tells a 304 from a full page. */
  bytes_per_req?: number;
  /** CPU time (user + system) the server process spent per answer during the measured run. */
  cpu_ms_per_req?: number;
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
  /** The server's process id: its CPU time over the measured run is reported per answer (Linux /proc). */
  cpuPid?: number;
}

const WRK = ['/usr/bin/wrk', '/usr/local/bin/wrk'].find((p) => existsSync(p));

export function loadTool(): 'wrk' | 'autocannon' {
  return WRK ? 'wrk' : 'autocannon';
}

function toMs(value: string, unit: string): number {
  const v = Number(value);
  return unit === 'us' ? v / 1000 : unit === 's' ? v * 1000 : unit === 'm' ? v * 60_000 : v;
}

const TICKS_PER_SECOND = 100; // Linux USER_HZ: /proc/<pid>/stat counts CPU time in these

/** A process's CPU time so far (user + system), in milliseconds. */
export function cpuMs(pid: number): number {
  // Fields after the command name (which may hold spaces, inside parentheses): utime and stime are 12th and 13th.
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_SECOND;
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
    const cpu0 = o.cpuPid ? cpuMs(o.cpuPid) : NaN;
    const out = spawnSync(WRK, args(seconds), { encoding: 'utf8', timeout: (seconds + 30) * 1000 });
    const cpu1 = o.cpuPid ? cpuMs(o.cpuPid) : NaN;
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
    const transfer = /Transfer\/sec:\s+([\d.]+)(B|KB|MB|GB)/.exec(text);
    const unit = { B: 1, KB: 1024, MB: 1024 ** 2, GB: 1024 ** 3 } as const;
    const bytesPerSec = transfer ? Number(transfer[1]) * unit[transfer[2] as keyof typeof unit] : NaN;
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
      bytes_per_req: Math.round(bytesPerSec / rps),
      ...(o.cpuPid ? { cpu_ms_per_req: n > 0 ? (cpu1 - cpu0) / n : NaN } : {}),
    };
  }
  // autocannon ships no types: its function is given the one shape we call it with, and its result is parsed.
  const autocannon = ((await import('autocannon')) as { default: (opts: AutocannonOptions) => Promise<unknown> })
    .default;
  const opts: AutocannonOptions = { url: o.url, connections, duration: seconds, headers: o.headers, workers: 2 };
  if (warmup > 0) await autocannon({ ...opts, duration: warmup });
  const r = AutocannonResult.parse(await autocannon(opts));
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
