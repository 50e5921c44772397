// One number-pair that changes whenever anything is written to the database, by this process or another:
// `PRAGMA data_version` moves when another connection commits, `total_changes()` counts every row this connection
// has inserted, updated or deleted (triggers and cascades included). The response cache and the memos keep a value
// only while the generation is the one they saw when they computed it — no table or SQL is ever inspected.
// See docs/decisions/009-serving-through-the-adapter.md.
import type Database from 'better-sqlite3';
import { db } from './client';

interface Probe {
  statement: Database.Statement;
  /** Tells connections apart: a reopened database starts counting its changes from zero again. */
  serial: number;
}

const probes = new WeakMap<Database.Database, Probe>();
let opened = 0;

/** The database's write generation as an opaque string; equal strings mean nothing was written in between. */
export function writeGeneration(): string {
  const sqlite = db().$client;
  let probe = probes.get(sqlite);
  if (!probe) {
    const statement = sqlite.prepare(
      'SELECT (SELECT data_version FROM pragma_data_version) AS v, total_changes() AS t',
    );
    probe = { statement, serial: ++opened };
    probes.set(sqlite, probe);
  }
  const { v, t } = probe.statement.get() as { v: number; t: number };
  return `${probe.serial}.${v}.${t}`;
}
