/**
 * Counts failures per key (an account, an address) in a sliding window. In memory: Wakebook runs as one
 * process, and a restart forgiving old failures is acceptable for a team-sized app.
 */
export class Throttle {
  private failures = new Map<string, number[]>();
  constructor(
    private readonly limit: number,
    private readonly windowMs: number,
    private readonly now: () => number = Date.now,
  ) {}

  /** Seconds until the key may try again, or 0 when it may try now. */
  retryAfter(key: string): number {
    const times = this.recent(key);
    if (times.length < this.limit) return 0;
    return Math.max(1, Math.ceil((times[0] + this.windowMs - this.now()) / 1000));
  }

  fail(key: string): void {
    const times = this.recent(key);
    times.push(this.now());
    this.failures.set(key, times);
    if (this.failures.size > 10_000) this.prune();
  }

  /**
   * Counts an attempt now, before its outcome is known, so attempts made in parallel cannot all pass the check
   * while the first is still being verified. Returns a function that takes this one attempt back.
   */
  reserve(key: string): () => void {
    const at = this.now();
    this.fail(key);
    let released = false;
    return () => {
      if (released) return;
      released = true;
      const times = this.failures.get(key);
      const i = times?.indexOf(at) ?? -1;
      if (times && i >= 0) times.splice(i, 1);
    };
  }

  clear(key: string): void {
    this.failures.delete(key);
  }

  private recent(key: string): number[] {
    const cutoff = this.now() - this.windowMs;
    return (this.failures.get(key) ?? []).filter((t) => t > cutoff);
  }

  private prune(): void {
    for (const key of this.failures.keys()) {
      if (this.recent(key).length === 0) this.failures.delete(key);
    }
  }
}

const FIFTEEN_MINUTES = 15 * 60 * 1000;
/** Sign-in: 5 wrong passwords per account, 30 per address, in 15 minutes. */
export const signInByAccount = new Throttle(5, FIFTEEN_MINUTES);
export const signInByAddress = new Throttle(30, FIFTEEN_MINUTES);
/** Reset requests: 3 per account and 10 per address in 15 minutes. */
export const resetByAccount = new Throttle(3, FIFTEEN_MINUTES);
export const resetByAddress = new Throttle(10, FIFTEEN_MINUTES);
