// Which tables a request read, and which tables changed since: lets the response cache (and memoised derived data)
// keep an answer until a table it actually read is written, instead of dropping everything at any write. A comment
// on one record then leaves the calculation pages, the records list and search results cached.
//
// Every statement is prepared through the instrumented connection (Drizzle included), so its SQL is known:
// - reads: every table whose name appears in a statement run while a read scope is open joins that scope (names
//   are matched as words of the SQL, so a join, a subquery or a raw query is never missed; a false match only
//   makes the answer expire sooner);
// - writes: INSERT/UPDATE/DELETE/REPLACE bump their table and every table that table's triggers write;
// - anything else that may write (DDL, exec, an unknown statement, a write by another process, a write that
//   slipped past the statements: total_changes() moved) bumps every table at once.
import { AsyncLocalStorage } from 'node:async_hooks';
import type Database from 'better-sqlite3';

export type TableVersions = ReadonlyMap<string, number>;

/** A snapshot of what an answer depended on: each table it read with that table's version when it started. */
export interface Dependencies {
  general: number;
  tables: [string, number][];
}

const versions = new Map<string, number>();
/** Bumped by changes that cannot be pinned to tables; every dependency includes it. */
let general = 0;
const scope = new AsyncLocalStorage<Set<string>>();
let connection: Instrumented | null = null;

interface Instrumented {
  sqlite: Database.Database;
  tables: Set<string>;
  /** Table → tables its triggers (transitively) write, itself included. */
  writes: Map<string, Set<string>>;
  /** Virtual tables that read another (fts5vocab) → the table they read. */
  aliases: Map<string, string>;
  totalChanges: Database.Statement;
  dataVersion: Database.Statement;
  expectedTotal: number;
  expectedDataVersion: number;
}

const WORD = /[A-Za-z_][A-Za-z0-9_]*/g;
const WRITE =
  /^\s*(?:insert(?:\s+or\s+\w+)?\s+into|replace\s+into|update(?:\s+or\s+\w+)?|delete\s+from)\s+[`"[]?(\w+)/i;
const HARMLESS =
  /^\s*(?:select|with(?![\s\S]*\b(?:insert|update|delete|replace)\b)|pragma\s+(?:data_version|table_info|index_list|foreign_key_list|integrity_check|quick_check|journal_mode|page_count|page_size|freelist_count)|begin|commit|end|rollback|savepoint|release|explain)\b/i;

function namesIn(sql: string, tables: Set<string>): string[] {
  const out = new Set<string>();
  for (const w of sql.match(WORD) ?? []) if (tables.has(w)) out.add(w);
  return [...out];
}

function bump(table: string): void {
  versions.set(table, (versions.get(table) ?? 0) + 1);
}

/** Every table, at once: the safe answer to a change we cannot attribute. */
export function bumpAll(): void {
  general++;
}

/** Wraps a connection's prepare() and exec() so reads and writes are seen. Call once per opened connection. */
export function instrumentConnection(sqlite: Database.Database): void {
  const tables = new Set<string>(
    sqlite.prepare("select name from sqlite_master where type in ('table', 'view')").pluck().all() as string[],
  );
  const aliases = new Map<string, string>();
  for (const row of sqlite
    .prepare("select name, sql from sqlite_master where type = 'table' and sql like 'CREATE VIRTUAL TABLE%'")
    .all() as { name: string; sql: string }[]) {
    const m = /using\s+fts5vocab\s*\(\s*[`"']?(\w+)/i.exec(row.sql);
    if (m) aliases.set(row.name, m[1]);
  }
  const direct = new Map<string, Set<string>>();
  for (const row of sqlite.prepare("select tbl_name, sql from sqlite_master where type = 'trigger'").all() as {
    tbl_name: string;
    sql: string;
  }[]) {
    const set = direct.get(row.tbl_name) ?? new Set<string>();
    for (const name of namesIn(row.sql, tables)) set.add(name);
    direct.set(row.tbl_name, set);
  }
  const writes = new Map<string, Set<string>>();
  for (const table of tables) {
    const seen = new Set<string>([table]);
    const todo = [table];
    while (todo.length)
      for (const next of direct.get(todo.pop()!) ?? []) if (!seen.has(next)) (seen.add(next), todo.push(next));
    writes.set(table, seen);
  }
  const totalChanges = sqlite.prepare('select total_changes()').pluck();
  const dataVersion = sqlite.prepare('pragma data_version').pluck();
  const c: Instrumented = {
    sqlite,
    tables,
    writes,
    aliases,
    totalChanges,
    dataVersion,
    expectedTotal: 0,
    expectedDataVersion: 0,
  };
  c.expectedTotal = totalChanges.get() as number;
  c.expectedDataVersion = dataVersion.get() as number;
  connection = c;
  general++;

  const prepare = sqlite.prepare.bind(sqlite);
  const exec = sqlite.exec.bind(sqlite);
  sqlite.exec = ((source: string) => {
    try {
      return exec(source);
    } finally {
      bumpAll();
      c.expectedTotal = totalChanges.get() as number;
    }
  }) as typeof sqlite.exec;
  sqlite.prepare = ((source: string) => {
    const stmt = prepare(source);
    const written = WRITE.exec(source)?.[1];
    const read = namesIn(source, tables).flatMap((t) => (aliases.has(t) ? [t, aliases.get(t)!] : [t]));
    const unknown = !written && !HARMLESS.test(source);
    for (const method of ['run', 'get', 'all', 'iterate'] as const) {
      const original = stmt[method] as (...args: unknown[]) => unknown;
      (stmt as unknown as Record<string, unknown>)[method] = function (this: Database.Statement, ...args: unknown[]) {
        const reads = scope.getStore();
        if (reads) for (const t of read) reads.add(t);
        try {
          return original.apply(this, args);
        } finally {
          if (written) {
            for (const t of c.writes.get(written) ?? [written]) bump(t);
            c.expectedTotal = totalChanges.get() as number;
          } else if (unknown) {
            bumpAll();
            c.expectedTotal = totalChanges.get() as number;
          }
        }
      };
    }
    return stmt;
  }) as typeof sqlite.prepare;
}

/** Notices writes that did not go through an instrumented statement (another process, the backup API, …). */
function settle(): void {
  const c = connection;
  if (!c) return;
  const total = c.totalChanges.get() as number;
  const dv = c.dataVersion.get() as number;
  if (total !== c.expectedTotal || dv !== c.expectedDataVersion) {
    c.expectedTotal = total;
    c.expectedDataVersion = dv;
    bumpAll();
  }
}

/** Runs fn with `read` as the read scope: every table a statement run inside it (or its continuations) names. */
export function readingInto<T>(read: Set<string>, fn: () => T): T {
  return scope.run(read, fn);
}

/** The current request's read scope, if one is open. */
export function currentReads(): Set<string> | undefined {
  return scope.getStore();
}

/** The versions now, to pair with what a render is about to read. */
export function currentVersions(): { general: number; tables: TableVersions } {
  settle();
  return { general, tables: new Map(versions) };
}

/** What an answer that read `read`, starting at `start`, depends on. */
export function dependencies(start: { general: number; tables: TableVersions }, read: Iterable<string>): Dependencies {
  return { general: start.general, tables: [...read].map((t) => [t, start.tables.get(t) ?? 0]) };
}

/** True while no table in deps has been written since (and nothing unattributable happened). */
export function stillValid(deps: Dependencies): boolean {
  settle();
  if (deps.general !== general) return false;
  for (const [t, v] of deps.tables) if ((versions.get(t) ?? 0) !== v) return false;
  return true;
}
