// Search benchmark (issue 6): a generated corpus indexed through the real migrations and triggers and queried by
// the real engine, against a plain SQLite FTS5 table (AND + prefix on every word, BM25, same tokenizer and prefix
// indexes) holding the same documents and answering the same queries in the same run. The corpus grows from
// 10,000 to 50,000 documents (the first 10,000 are the same), measured at both sizes. One row per figure:
// {name, n, docs, p50_ms, p99_ms, ...}; wall-clock and CPU time both, since this machine is shared.
// Reading of the figures: docs/decisions/006-search-fts5-with-vocabulary.md.
import Database from 'better-sqlite3';
import { fork } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '../src/lib/server/db/client';
import { SearchEngine } from '../src/lib/server/search/engine';
import { parseQuery, toMatchExpression } from '../src/lib/server/search/query';
import { generateCorpus, generateQueries, type BenchDoc, type BenchQuery } from './search-corpus';
import { percentile } from './stats';

const SIZES = [10_000, 50_000];
const QUERIES = 500;
const QUALITY_QUERIES = 100;
const LIMIT = 10;

const round = (x: number, d = 2) => Number(x.toFixed(d));
const mb = (bytes: number) => round(bytes / 1e6, 1);
const load = () => loadavg().map((x) => round(x, 1));

function timings(samples: { wall: number; cpu: number }[]) {
  const wall = samples.map((s) => s.wall).sort((a, b) => a - b);
  const cpu = samples.map((s) => s.cpu).sort((a, b) => a - b);
  return {
    n: samples.length,
    p50_ms: round(percentile(wall, 50), 3),
    p99_ms: round(percentile(wall, 99), 3),
    cpu_p50_ms: round(percentile(cpu, 50), 3),
    cpu_p99_ms: round(percentile(cpu, 99), 3),
    max_ms: round(wall[wall.length - 1], 2),
  };
}

async function measure<T>(fn: () => T | Promise<T>): Promise<{ value: T; wall: number; cpu: number }> {
  const t = performance.now();
  const c = process.cpuUsage();
  const value = await fn();
  const used = process.cpuUsage(c);
  return { value, wall: performance.now() - t, cpu: (used.user + used.system) / 1000 };
}

function fileMb(path: string): number {
  let total = 0;
  for (const suffix of ['', '-wal']) {
    try {
      total += statSync(path + suffix).size;
    } catch {
      // no WAL file
    }
  }
  return mb(total);
}

/** The app's schema (real migrations, so the real triggers) with one season and the subsystems the corpus uses. */
export function openOurs(file: string): Database.Database {
  const sqlite = openDatabase(file).$client;
  const now = Date.now();
  sqlite
    .prepare(
      "INSERT INTO seasons (id, name, starts_on, ends_on, phase, is_current, created_at) VALUES ('s1', '2025–26', '2025-09-01', '2026-08-31', 'build', 1, ?)",
    )
    .run(now);
  for (const slug of ['hull', 'propulsion', 'cooling', 'battery', 'solar', 'steering', 'telemetry', 'general']) {
    sqlite.prepare('INSERT INTO subsystems (slug, name, created_at) VALUES (?, ?, ?)').run(slug, slug, now);
  }
  return sqlite;
}

export function openBaseline(file: string): Database.Database {
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('synchronous = NORMAL');
  // Same tokenizer and prefix indexes as ours, so the comparison is of the query work, not of the table setup.
  sqlite.exec(
    "CREATE VIRTUAL TABLE docs USING fts5(title, body, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3 4')",
  );
  return sqlite;
}

/**
 * Inserts documents [from, to) of the corpus into both databases, timing each separately; ours goes through the
 * records and calculations tables, so through the triggers, 500 documents a transaction.
 */
export function build(ours: Database.Database, base: Database.Database, from: number, to: number) {
  const now = Date.now();
  const rec = ours.prepare(
    "INSERT INTO records (id, kind, title, subsystem_slug, season_id, status, body, body_text, created_at, updated_at) VALUES (?, ?, ?, ?, 's1', ?, '{}', ?, ?, ?)",
  );
  const calc = ours.prepare(
    "INSERT INTO calculations (id, kind, title, subsystem_slug, season_id, notes, inputs, created_at, updated_at) VALUES (?, 'propeller', ?, ?, 's1', ?, ?, ?, ?)",
  );
  const plain = base.prepare('INSERT INTO docs (title, body) VALUES (?, ?)');
  const oursBatch = ours.transaction((docs: BenchDoc[], first: number) => {
    docs.forEach((d, k) => {
      const id = `b${first + k}`;
      if (d.type === 'calculation') calc.run(id, d.title, d.subsystem, d.body, '{"blades":3,"water":"sea"}', now, now);
      else
        rec.run(
          id,
          d.type === 'guide' ? 'lesson' : d.type,
          d.title,
          d.subsystem,
          d.type === 'decision' ? 'accepted' : 'open',
          d.body,
          now,
          now,
        );
    });
  });
  const baseBatch = base.transaction((docs: BenchDoc[]) => {
    for (const d of docs) plain.run(d.title, d.body);
  });
  let oursMs = 0;
  let baseMs = 0;
  let batch: BenchDoc[] = [];
  let done = from;
  const flush = () => {
    let t = performance.now();
    oursBatch(batch, done);
    oursMs += performance.now() - t;
    t = performance.now();
    baseBatch(batch);
    baseMs += performance.now() - t;
    done += batch.length;
    batch = [];
  };
  let i = 0;
  for (const d of generateCorpus(to)) {
    if (i++ < from) continue;
    batch.push(d);
    if (batch.length === 500) flush();
  }
  if (batch.length) flush();
  return { oursMs, baseMs };
}

function baselineExpression(q: string): string | null {
  const { terms } = parseQuery(q);
  return terms.length ? terms.map((t) => `"${t}"*`).join(' AND ') : null;
}

/** A fresh process opens the database and searches, as the server does after a restart. */
function restart(file: string, typoQuery: string): Promise<Record<string, number | string>> {
  return new Promise((resolve, reject) => {
    const child = fork(new URL('./search-restart.ts', import.meta.url).pathname, [file, typoQuery], {
      execArgv: ['--import', 'tsx', '--expose-gc'],
      stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    });
    child.once('message', (m) => resolve(m as Record<string, number | string>));
    child.once('exit', (code) => code !== 0 && reject(new Error(`restart probe exited with ${code}`)));
  });
}

export default async function benchSearch(): Promise<object[]> {
  const out: object[] = [];
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-search-bench-'));
  const oursFile = join(dir, 'ours.db');
  const baseFile = join(dir, 'base.db');
  const ours = openOurs(oursFile);
  const base = openBaseline(baseFile);
  try {
    let indexed = 0;
    for (const n of SIZES) {
      const loadBefore = load();
      const built = build(ours, base, indexed, n);
      const docsAdded = n - indexed;
      indexed = n;
      const terms = ours.prepare('SELECT count(*) FROM search_vocab').pluck().get() as number;
      out.push({
        name: 'search.build.ours',
        n: docsAdded,
        docs: n,
        p50_ms: round(built.oursMs / docsAdded, 3),
        p99_ms: null,
        total_ms: round(built.oursMs),
        db_mb: fileMb(oursFile),
        distinct_terms: terms,
        note: 'per document, through the record/calculation triggers',
      });
      out.push({
        name: 'search.build.fts5-baseline',
        n: docsAdded,
        docs: n,
        p50_ms: round(built.baseMs / docsAdded, 3),
        p99_ms: null,
        total_ms: round(built.baseMs),
        db_mb: fileMb(baseFile),
      });

      if (n === SIZES[SIZES.length - 1]) {
        // A restart with no saved vocabulary (read from FTS5), then one with the copy that run saved.
        ours.prepare('DELETE FROM search_terms').run();
        ours.prepare('UPDATE search_state SET terms_generation = -1').run();
        ours.pragma('wal_checkpoint(TRUNCATE)');
        for (const from of ['FTS5', 'saved copy']) {
          const r = await restart(oursFile, 'propellr ventilation');
          out.push({
            name: 'search.restart.first-search',
            n: 1,
            docs: n,
            p50_ms: r.firstSearchMs,
            p99_ms: r.firstSearchMs,
            vocabulary_from: from,
            ...r,
          });
        }
      }

      // In this process: a new engine (the one from the smaller size has not seen the added documents).
      const engine = new SearchEngine(ours);
      const heap0 = process.memoryUsage().heapUsed;
      const loaded = await measure(() => engine.settled());
      out.push({
        name: 'search.vocabulary.load',
        n: 1,
        docs: n,
        p50_ms: round(loaded.wall),
        p99_ms: round(loaded.wall),
        cpu_ms: round(loaded.cpu),
        terms: engine.vocabularySize,
        heap_mb_delta: mb(process.memoryUsage().heapUsed - heap0),
      });

      const queries = generateQueries(QUERIES, 66 + n);
      const baseStmt = base.prepare(
        'SELECT rowid, title, bm25(docs) AS score FROM docs WHERE docs MATCH ? ORDER BY rank LIMIT ?',
      );
      const runBase = (q: string) => {
        const m = baselineExpression(q);
        return m ? baseStmt.all(m, LIMIT) : [];
      };
      for (const q of queries.slice(0, 30)) {
        await engine.search({ q: q.q, limit: LIMIT });
        runBase(q.q);
      }
      const isWord = ours.prepare('SELECT 1 FROM search_vocab WHERE term = ?').pluck();
      const ourTimes: Record<string, { wall: number; cpu: number }[]> = { all: [], exact: [], prefix: [], typo: [] };
      const baseTimes: { wall: number; cpu: number }[] = [];
      let typoFixed = 0;
      let typoTotal = 0;
      let withHits = 0;
      for (const [i, q] of queries.entries()) {
        // Alternate which runs first so both meet the same background load.
        const order = i % 2 ? ['base', 'ours'] : ['ours', 'base'];
        for (const which of order) {
          if (which === 'base') {
            baseTimes.push(await measure(() => runBase(q.q)));
            continue;
          }
          const m = await measure(() => engine.search({ q: q.q, limit: LIMIT }));
          ourTimes.all.push(m);
          ourTimes[q.shape].push(m);
          if (m.value.hits.length) withHits++;
          // A typo counts when it turned a word the index holds into one it lacks (among made-up words a typo
          // often lands on another real word: that is a different search, not a slip to correct).
          if (q.shape === 'typo' && q.intended && q.misspelt && isWord.get(q.intended) && !isWord.get(q.misspelt)) {
            typoTotal++;
            if (m.value.corrections.some((c) => c.to.includes(q.intended!))) typoFixed++;
          }
        }
      }
      const ours50 = timings(ourTimes.all);
      const base50 = timings(baseTimes);
      const agreement = await quality(engine, ours, queries.slice(0, QUALITY_QUERIES));
      out.push({
        name: 'search.query.ours',
        docs: n,
        ...ours50,
        limit: LIMIT,
        p99_over_baseline: round(ours50.p99_ms / base50.p99_ms),
        cpu_p99_over_baseline: round(ours50.cpu_p99_ms / base50.cpu_p99_ms),
        with_hits_pct: round((100 * withHits) / queries.length, 1),
        typo_queries_counted: typoTotal,
        typo_corrected_pct: round((100 * typoFixed) / Math.max(1, typoTotal), 1),
        ...agreement,
      });
      for (const shape of ['exact', 'prefix', 'typo'] as const)
        out.push({ name: `search.query.ours.${shape}`, docs: n, ...timings(ourTimes[shape]) });
      out.push({
        name: 'search.query.fts5-baseline',
        docs: n,
        ...base50,
        limit: LIMIT,
        note: 'top 10 by rank with titles: no snippet, no total',
        load_avg_before: loadBefore,
        load_avg_after: load(),
      });
    }
  } finally {
    ours.close();
    base.close();
    rmSync(dir, { recursive: true, force: true });
  }
  return out;
}

/**
 * How far the tiered, capped ranking is from plain BM25 over every match: the share of plain BM25's top 10 that
 * our top 10 also holds, for the same resolved words.
 */
async function quality(engine: SearchEngine, sqlite: Database.Database, queries: BenchQuery[]) {
  const exact = sqlite
    .prepare('SELECT rowid FROM search_fts WHERE search_fts MATCH ? ORDER BY bm25(search_fts, 8.0, 1.0) LIMIT ?')
    .pluck();
  const docId = sqlite.prepare('SELECT id FROM search_docs WHERE ref_id = ? AND type = ?').pluck();
  let shared = 0;
  let possible = 0;
  let broad = 0;
  for (const q of queries) {
    const m = toMatchExpression(await engine.resolve(parseQuery(q.q).terms));
    if (!m) continue;
    const reference = new Set(exact.all(m, LIMIT) as number[]);
    if (reference.size === 0) continue;
    const r = await engine.search({ q: q.q, limit: LIMIT });
    if (r.totalCapped) broad++;
    shared += r.hits.filter((h) => reference.has(docId.get(h.id, h.type) as number)).length;
    possible += reference.size;
  }
  return {
    top10_shared_with_plain_bm25_pct: round((100 * shared) / Math.max(1, possible), 1),
    quality_queries: queries.length,
    quality_broad_queries: broad,
  };
}
