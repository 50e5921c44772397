// One number-pair that changes whenever anything is written to the database, by this process or another:
// `PRAGMA data_version` moves when another connection commits, `total_changes()` counts every row this connection
// has inserted, updated or deleted (triggers and cascades included). The response cache and the memos keep a value
// only while the generation is the one they saw when they computed it — no table or SQL is ever inspected.
// See docs/decisions/009-serving-through-the-adapter.md.
import { prepared } from './client';

let opened = 0;

/** The database's write generation as an opaque string; equal strings mean nothing was written in between. */
export function writeGeneration(): string {
  const probe = prepared('db.write-generation', (d) => ({
    statement: d.$client.prepare('SELECT (SELECT data_version FROM pragma_data_version) AS v, total_changes() AS t'),
    // Tells connections apart: a reopened database starts counting its changes from zero again.
    serial: ++opened,
  }));
  const { v, t } = probe.statement.get() as { v: number; t: number };
  return `${probe.serial}.${v}.${t}`;
}
