// Derived data (readiness scores, onboarding routes) that many pages read and only a write can change:
// computed once per database version and dropped at the first write. Values are shared between requests,
// so callers must treat them as read-only.
import { dataVersion } from './db/client';

let version = '';
const values = new Map<string, unknown>();

/** The value for key computed since the last write, or compute() now. A rejected promise is not kept. */
export function memoUntilWrite<T>(key: string, compute: () => T): T {
  const now = dataVersion();
  if (now !== version) {
    values.clear();
    version = now;
  }
  if (values.has(key)) return values.get(key) as T;
  const value = compute();
  // A compute that wrote to the database has already made its own result stale: do not keep it.
  if (dataVersion() !== now) return value;
  values.set(key, value);
  if (value instanceof Promise) value.catch(() => values.delete(key));
  return value;
}
