// Derived data (readiness scores, onboarding routes) that many pages read and only a write can change: computed
// once and kept while the database's write generation (db/generation.ts) is the one it was computed at. Values are
// shared between requests, so callers must treat them as read-only.
import { writeGeneration } from './db/generation';

const values = new Map<string, { generation: string; value: unknown }>();

/** The value for key computed since the last write to the database, or compute() now. A rejection is not kept. */
export function memoUntilWrite<T>(key: string, compute: () => T): T {
  // Under `astro dev` guides change on disk, which the database generation cannot see.
  if (import.meta.env.MODE === 'development') return compute();
  const generation = writeGeneration();
  const hit = values.get(key);
  if (hit && hit.generation === generation) return hit.value as T;
  const value = compute();
  values.set(key, { generation, value });
  if (value instanceof Promise) {
    value.catch(() => {
      if (values.get(key)?.value === value) values.delete(key);
    });
  }
  return value;
}
