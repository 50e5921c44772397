// Which documents make a page of results, in which order. Two tiers:
//   1. documents with every word in the title (search_titles, a small index), by BM25 over the title;
//   2. the other matches, by BM25 over title and body with a title word worth eight body words.
// BM25 is computed for each row it ranks, about 1–3 µs a row here, so ranking every match of a word found in
// most of 50,000 documents costs 30–70 ms. When a query matches more than BROAD documents, tier 2 therefore ranks
// the BROAD most recently written of them (a write gives a document a new, higher rowid) and the total is reported
// as "at least BROAD". Tier 1 still ranks every title match, which is what keeps broad queries useful.
// A page can cross from tier 1 into tier 2; offsets count tier 1 first.
import type Database from 'better-sqlite3';
import type { SearchType } from '../../schemas/search';

export const BROAD = 500;

export interface Filters {
  type?: SearchType;
  subsystem?: string;
  seasonId?: string;
}

export interface RankedHit {
  docId: number;
  score: number;
  titleMatch: boolean;
}

interface StatementSource {
  stmt(sql: string): Database.Statement;
}

function filterSql(f: Filters, alias: string): { join: string; where: string; args: string[] } {
  const parts: string[] = [];
  const args: string[] = [];
  if (f.type) {
    parts.push('d.type = ?');
    args.push(f.type);
  }
  if (f.subsystem) {
    parts.push('d.subsystem = ?');
    args.push(f.subsystem);
  }
  if (f.seasonId) {
    parts.push('d.season_id = ?');
    args.push(f.seasonId);
  }
  if (parts.length === 0) return { join: '', where: '', args };
  // CROSS JOIN keeps the FTS5 table as the outer loop, so its order (rank or rowid) is used as it comes.
  return { join: ` CROSS JOIN search_docs d ON d.id = ${alias}.rowid`, where: ` AND ${parts.join(' AND ')}`, args };
}

export function rankPage(db: StatementSource, match: string, f: Filters, offset: number, limit: number) {
  const t = filterSql(f, 't');
  const titleTotal = db
    .stmt(`SELECT count(*) FROM search_titles t${t.join} WHERE search_titles MATCH ?${t.where}`)
    .pluck()
    .get(match, ...t.args) as number;
  const hits: RankedHit[] = [];
  if (offset < titleTotal) {
    const rows = db
      .stmt(
        `SELECT t.rowid AS docId, -t.rank AS score FROM search_titles t${t.join} WHERE search_titles MATCH ?${t.where} ORDER BY t.rank LIMIT ? OFFSET ?`,
      )
      .all(match, ...t.args, limit, offset) as { docId: number; score: number }[];
    for (const h of rows) hits.push({ ...h, titleMatch: true });
  }

  const b = filterSql(f, 'f');
  const cutoff = db
    .stmt(
      `SELECT f.rowid FROM search_fts f${b.join} WHERE search_fts MATCH ?${b.where} ORDER BY f.rowid DESC LIMIT 1 OFFSET ${BROAD - 1}`,
    )
    .pluck()
    .get(match, ...b.args) as number | undefined;
  const want = offset + limit - titleTotal;
  if (want > 0) {
    const skip = Math.max(0, offset - titleTotal);
    // Every title match is in tier 1 already (when it passes the filters) or filtered out: skip them all.
    const rest = db
      .stmt(
        `SELECT f.rowid AS docId, -bm25(search_fts, 8.0, 1.0) AS score FROM search_fts f${b.join}
          WHERE search_fts MATCH ? AND f.rowid >= ?${b.where}
            AND f.rowid NOT IN (SELECT rowid FROM search_titles WHERE search_titles MATCH ?)
          ORDER BY score DESC LIMIT ? OFFSET ?`,
      )
      .all(match, cutoff ?? 0, ...b.args, match, want - skip, skip) as { docId: number; score: number }[];
    for (const h of rest) hits.push({ ...h, titleMatch: false });
  }

  if (cutoff !== undefined) return { hits, total: Math.max(BROAD, titleTotal), totalCapped: true };
  const total = db
    .stmt(`SELECT count(*) FROM search_fts f${b.join} WHERE search_fts MATCH ?${b.where}`)
    .pluck()
    .get(match, ...b.args) as number;
  return { hits, total, totalCapped: false };
}
