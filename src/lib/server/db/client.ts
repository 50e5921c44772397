import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';
import { settings } from '../config';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

let instance: Db | undefined;

/** Where the committed migrations live: the app is run from the project (or release) folder. */
export function migrationsFolder(): string {
  return resolve(process.cwd(), 'drizzle');
}

/** Opens a database file with the pragmas Wakebook relies on, and applies pending migrations. */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') mkdirSync(dirname(resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  // WAL with synchronous=NORMAL is durable across process crashes (only a power loss can drop the last commits).
  sqlite.pragma('synchronous = NORMAL');
  const db: Db = drizzle(sqlite, { schema, casing: 'snake_case' });
  migrate(db, { migrationsFolder: migrationsFolder() });
  return db;
}

/** The one database of this process, opened on first use from WAKEBOOK_DB. */
export function db(): Db {
  instance ??= openDatabase(settings().WAKEBOOK_DB);
  return instance;
}

export function closeDatabase(): void {
  instance?.$client.close();
  instance = undefined;
}

const preparedCache = new WeakMap<Db, Map<string, unknown>>();

/**
 * A query prepared once per database and reused: building and preparing SQL costs more than running a
 * primary-key lookup, so hot paths (every page's header, record reads) use this.
 */
export function prepared<T>(key: string, build: (d: Db) => T): T {
  const d = db();
  let cache = preparedCache.get(d);
  if (!cache) preparedCache.set(d, (cache = new Map<string, unknown>()));
  if (!cache.has(key)) cache.set(key, build(d));
  return cache.get(key) as T;
}
