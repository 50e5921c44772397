// Timing helpers shared by the benchmark scripts. Percentiles are nearest-rank on the sorted samples.

export interface BenchSummary {
  name: string;
  n: number;
  p50_ms: number;
  p99_ms: number;
  ops_per_s: number;
  [extra: string]: unknown;
}

export function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const rank = Math.ceil((p / 100) * sorted.length);
  return sorted[Math.min(sorted.length, Math.max(1, rank)) - 1];
}

const round = (x: number, digits = 4) => Number(x.toFixed(digits));

export function summarize(name: string, samplesMs: number[], extra?: object): BenchSummary {
  const sorted = [...samplesMs].sort((a, b) => a - b);
  const total = samplesMs.reduce((a, b) => a + b, 0);
  return {
    name,
    n: samplesMs.length,
    p50_ms: round(percentile(sorted, 50)),
    p99_ms: round(percentile(sorted, 99)),
    ops_per_s: total > 0 ? round((1000 * samplesMs.length) / total, 1) : 0,
    ...(extra ?? {}),
  };
}

/** Runs fn n times (after a short warm-up) and returns each call's duration in milliseconds. */
export function timeIt(fn: (i: number) => unknown, n: number, warmup = Math.min(50, n)): number[] {
  for (let i = 0; i < warmup; i++) fn(i);
  const samples = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    fn(i);
    samples[i] = performance.now() - t0;
  }
  return samples;
}
