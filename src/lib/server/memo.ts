// Derived data (readiness scores, onboarding routes) that many pages read and only a write can change:
// computed once and kept until a table it read is written (src/lib/server/db/changes.ts). Values are shared
// between requests, so callers must treat them as read-only.
import { currentReads, currentVersions, dependencies, readingInto, stillValid, type Dependencies } from './db/changes';

interface Memo {
  value: unknown;
  /** Tables the computation read; a request that uses the value read them too. */
  read: Set<string>;
  /** Null while an asynchronous computation is still running. */
  deps: Dependencies | null;
}

const values = new Map<string, Memo>();

function share(memo: Memo): void {
  const outer = currentReads();
  if (!outer) return;
  const add = () => {
    for (const t of memo.read) outer.add(t);
  };
  // Registered before the caller awaits the promise, so the tables are added before the caller goes on.
  if (memo.deps === null && memo.value instanceof Promise) memo.value.then(add, () => {});
  else add();
}

/** The value for key computed since the last write to what it read, or compute() now. A rejection is not kept. */
export function memoUntilWrite<T>(key: string, compute: () => T): T {
  // Under `astro dev` guides change on disk, which no table version can see.
  if (import.meta.env.MODE === 'development') return compute();
  const hit = values.get(key);
  if (hit && (hit.deps === null || stillValid(hit.deps))) {
    share(hit);
    return hit.value as T;
  }
  const start = currentVersions();
  const memo: Memo = { value: undefined, read: new Set(), deps: null };
  memo.value = readingInto(memo.read, compute);
  values.set(key, memo);
  if (memo.value instanceof Promise) {
    memo.value.then(
      () => {
        memo.deps = dependencies(start, memo.read);
      },
      () => {
        if (values.get(key) === memo) values.delete(key);
      },
    );
  } else memo.deps = dependencies(start, memo.read);
  share(memo);
  return memo.value as T;
}

/** Forgets every memoised value (tests that swap the database). */
export function clearMemos(): void {
  values.clear();
}
