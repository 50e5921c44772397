// The index's word list outside FTS5. FTS5's own term list (search_vocab) is the truth, but every read of it also
// reads each listed word's document list (~1–2 s for all 212,000 words of 50,000 documents here; ~1 ms to list the
// words starting with "propel"). So every word is also kept in search_terms, a plain table, with the index
// generation it reflects (search_state): when that generation is current, a start reads the typo vocabulary from
// it and a search asks it which words exist. Long reads and writes go in slices that give the event loop back.
import type Database from 'better-sqlite3';
import { Vocabulary } from './vocabulary';

const SLICE = 20_000;
/** In a large index, a word found in one document only is mostly a name, a code or somebody's typo: never offered. */
const LARGE_INDEX_DOCS = 5_000;

const yieldToEventLoop = () => new Promise<void>((r) => setImmediate(r));

export type TermRow = [term: string, docs: number];

function minDocsFor(sqlite: Database.Database): number {
  const docs = sqlite.prepare('SELECT count(*) FROM search_docs').pluck().get() as number;
  return docs >= LARGE_INDEX_DOCS ? 2 : 1;
}

async function readInto(vocab: Vocabulary, sqlite: Database.Database, sql: string, keep?: TermRow[]): Promise<void> {
  const minDocs = minDocsFor(sqlite);
  const page = sqlite.prepare(sql).raw();
  let after = '';
  for (;;) {
    const rows = page.all(after, SLICE) as TermRow[];
    for (const r of rows) {
      if (r[1] >= minDocs) vocab.add(r[0], r[1]);
      keep?.push(r);
    }
    if (rows.length < SLICE) return;
    after = rows[rows.length - 1][0];
    await yieldToEventLoop();
  }
}

export interface IndexState {
  generation: number;
  termsGeneration: number;
}

export function indexState(sqlite: Database.Database): IndexState {
  return sqlite
    .prepare('SELECT generation, terms_generation AS termsGeneration FROM search_state WHERE id = 1')
    .get() as IndexState;
}

export async function readSaved(sqlite: Database.Database): Promise<Vocabulary> {
  const vocab = new Vocabulary();
  await readInto(vocab, sqlite, 'SELECT term, docs FROM search_terms WHERE term > ? ORDER BY term LIMIT ?');
  return vocab;
}

/** The typo vocabulary from FTS5, and every word with its document count (for `save`). */
export async function readIndex(sqlite: Database.Database): Promise<{ vocab: Vocabulary; rows: TermRow[] }> {
  const vocab = new Vocabulary();
  const rows: TermRow[] = [];
  await readInto(vocab, sqlite, 'SELECT term, doc FROM search_vocab WHERE term > ? ORDER BY term LIMIT ?', rows);
  return { vocab, rows };
}

/** Replaces the saved word list with `rows`, as of index generation `generation`. */
export async function save(sqlite: Database.Database, rows: TermRow[], generation: number): Promise<void> {
  // Marked stale first, so a copy left half-written by a crash is never taken for current.
  sqlite.transaction(() => {
    sqlite.prepare('UPDATE search_state SET terms_generation = -1 WHERE id = 1').run();
    sqlite.prepare('DELETE FROM search_terms').run();
  })();
  const insert = sqlite.prepare('INSERT INTO search_terms (term, docs) VALUES (?, ?) ON CONFLICT (term) DO NOTHING');
  for (let i = 0; i < rows.length; i += SLICE) {
    await yieldToEventLoop();
    sqlite.transaction(() => {
      for (const [t, d] of rows.slice(i, i + SLICE)) insert.run(t, d);
    })();
  }
  sqlite.prepare('UPDATE search_state SET terms_generation = ? WHERE id = 1').run(generation);
}

/**
 * Saves words first seen in a write. Every write moves the index generation on by one (the triggers), so when the
 * saved list was current just before this write, it is current again now.
 */
export function saveAdded(sqlite: Database.Database, terms: string[]): void {
  const insert = sqlite.prepare('INSERT INTO search_terms (term, docs) VALUES (?, 1) ON CONFLICT (term) DO NOTHING');
  sqlite.transaction(() => {
    for (const t of terms) insert.run(t);
    sqlite
      .prepare(
        'UPDATE search_state SET terms_generation = generation WHERE id = 1 AND terms_generation = generation - 1',
      )
      .run();
  })();
}
