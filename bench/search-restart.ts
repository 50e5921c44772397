// Child of bench/search.ts: a fresh process opens a built search database and answers its first searches, the way
// the server does after a restart. Reports through IPC: milliseconds from opening the database (and from the
// process start, which includes Node and tsx starting), and the memory search holds once its work is done.
import Database from 'better-sqlite3';
import { SearchEngine } from '../src/lib/server/search/engine';

const [file, typoQuery] = process.argv.slice(2);
const gc = (globalThis as { gc?: () => void }).gc;
gc?.();
const rss0 = process.memoryUsage().rss;
const heap0 = process.memoryUsage().heapUsed;
const t0 = performance.now();
const sqlite = new Database(file);
sqlite.pragma('journal_mode = WAL');
const engine = new SearchEngine(sqlite);
const plain = await engine.search({ q: 'propeller', limit: 10 });
const t1 = performance.now();
const typo = await engine.search({ q: typoQuery, limit: 10 });
const t2 = performance.now();
await engine.settled();
const t3 = performance.now();
const peakRss = process.memoryUsage().rss;
gc?.();
const r = (x: number) => Math.round(x * 10) / 10;
process.send!({
  firstSearchMs: r(t1 - t0),
  firstTypoSearchMs: r(t2 - t0),
  fromProcessStartMs: r(t2),
  backgroundDoneMs: r(t3 - t0),
  plainHits: plain.hits.length,
  typoCorrectedTo: typo.corrections.flatMap((c) => c.to).join(' '),
  vocabularyTerms: engine.vocabularySize,
  searchRssMb: r((process.memoryUsage().rss - rss0) / 1e6),
  searchPeakRssMb: r((peakRss - rss0) / 1e6),
  searchHeapMb: r((process.memoryUsage().heapUsed - heap0) / 1e6),
});
sqlite.close();
