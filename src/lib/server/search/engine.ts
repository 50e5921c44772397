// Search over one SQLite database. FTS5 finds and ranks and knows every word; the in-memory vocabulary corrects
// typos. Takes the database handle so the benchmark can run it on generated corpora;
// the app's one instance lives in ./index.ts. Why it is built this way, with figures:
// docs/decisions/006-search-fts5-with-vocabulary.md.
import type Database from 'better-sqlite3';
import { parseQuery, toMatchExpression, highlighterFor, MIN_PREFIX_LENGTH, type ResolvedTerm } from './query';
import { Vocabulary } from './vocabulary';
import { distinctTerms } from './tokens';
import { highlightHtml, snippetHtml } from './snippet';
import { indexState, readIndex, readSaved, save, saveAdded, type IndexState } from './vocabulary-store';
import { rankPage, type Filters } from './rank';
import type { SearchHit, SearchResponse, SearchType } from '../../schemas/search';
import { describeInputs } from '../../calc-describe';

export interface SearchParams extends Filters {
  q: string;
  limit: number;
  offset?: number;
}

export type SearchResult = Omit<SearchResponse, 'tookMs'>;

export interface GuideDoc {
  slug: string;
  title: string;
  subsystem: string;
  audience: string;
  text: string;
}

/** FTS5 answers prefixes up to this length from its prefix indexes; longer ones are expanded from its term list. */
const PREFIX_INDEX_MAX = 4;
const MAX_EXPANSION = 16;

// The saved vocabulary is a cache: if reading FTS5 or saving fails, search still works; the next start tries again.
function reportBackgroundFailure(e: unknown): void {
  console.error('[wakebook] search vocabulary refresh failed:', e);
}

export function hitUrl(type: string, id: string): string {
  if (type === 'guide') return `/guides/${id}`;
  if (type === 'calculation') return `/calculations/${id}`;
  return `/records/${id}`;
}

interface DetailRow {
  docId: number;
  type: SearchType;
  refId: string;
  subsystem: string;
  subsystemName: string | null;
  seasonId: string | null;
  season: string | null;
  status: string | null;
  kind: string | null;
  title: string;
  body: string;
  /** Calculations only: what a snippet is cut from instead of the indexed words, which hold field keys. */
  calcInputs: string | null;
  calcNotes: string | null;
}

/** The text a hit's snippet is cut from: for a calculation its notes and its inputs in words, never field keys. */
function snippetText(d: DetailRow): string {
  if (d.type !== 'calculation' || d.calcInputs === null || d.kind === null) return d.body;
  let inputs: Record<string, unknown> = {};
  try {
    inputs = JSON.parse(d.calcInputs) as Record<string, unknown>;
  } catch {
    // unreadable inputs: the notes alone
  }
  const words = describeInputs(d.kind, inputs);
  return [d.calcNotes, words && `${words}.`].filter(Boolean).join(' ');
}

export class SearchEngine {
  private vocabulary: Vocabulary | null = null;
  private loading: Promise<Vocabulary> | null = null;
  private background: Promise<void> = Promise.resolve();
  /** Words from writes made while a vocabulary is being read; added to it when it is ready. */
  private pending: string[] | null = null;
  private readonly statements = new Map<string, Database.Statement>();

  constructor(private readonly sqlite: Database.Database) {}

  stmt(sql: string): Database.Statement {
    let s = this.statements.get(sql);
    if (!s) {
      s = this.sqlite.prepare(sql);
      this.statements.set(sql, s);
    }
    return s;
  }

  get vocabularySize(): number {
    return this.vocabulary?.size ?? 0;
  }

  /**
   * Makes the typo-correction vocabulary ready: from the saved copy when there is one (and, when the index changed
   * since it was saved, a fresh read from FTS5 follows in the background), else from FTS5. Started once; later calls
   * share the promise. Searches do not wait for it unless a word needs correcting.
   */
  loadVocabulary(): Promise<Vocabulary> {
    this.loading ??= this.startLoading().catch((e) => {
      this.loading = null; // try again on the next search
      this.pending = null;
      throw e;
    });
    return this.loading;
  }

  /** Resolves when the vocabulary is ready and the work after it (fresh read, saving) is done. */
  async settled(): Promise<void> {
    await this.loadVocabulary();
    await this.background;
  }

  private async startLoading(): Promise<Vocabulary> {
    this.pending = [];
    const state = indexState(this.sqlite);
    if (state.termsGeneration >= 0) {
      this.adopt(await readSaved(this.sqlite));
      if (state.termsGeneration !== state.generation) this.background = this.rebuild().catch(reportBackgroundFailure);
    } else {
      const { vocab, rows } = await readIndex(this.sqlite);
      this.adopt(vocab);
      this.background = save(this.sqlite, rows, state.generation).catch(reportBackgroundFailure);
    }
    return this.vocabulary!;
  }

  private async rebuild(): Promise<void> {
    const { generation } = indexState(this.sqlite);
    this.pending = [];
    const { vocab, rows } = await readIndex(this.sqlite);
    this.adopt(vocab);
    await save(this.sqlite, rows, generation);
  }

  private adopt(vocab: Vocabulary): void {
    if (this.pending) vocab.addAll(this.pending);
    this.pending = null;
    this.vocabulary = vocab;
  }

  /** Adds the words of changed text to the vocabulary and its saved copy (FTS5 itself changed in the write). */
  noteText(text: string): void {
    const terms = [...distinctTerms(text)];
    this.pending?.push(...terms);
    if (!this.vocabulary) return;
    this.vocabulary.addAll(terms);
    saveAdded(this.sqlite, terms);
  }

  /** Called after a record or calculation was written. A deleted one (the write may be its deletion) teaches nothing. */
  noteChanged(type: 'record' | 'calculation', id: string): void {
    const row = (
      type === 'record'
        ? this.stmt("SELECT title || ' ' || body_text AS text FROM records WHERE id = ? AND deleted_at IS NULL").get(id)
        : this.stmt(
            "SELECT title || ' ' || notes || ' ' || kind || ' ' || inputs AS text FROM calculations WHERE id = ? AND deleted_at IS NULL",
          ).get(id)
    ) as { text: string } | undefined;
    if (row) this.noteText(row.text);
  }

  /**
   * The index's words from `term` on: is it a word, and (when asked) which words start with it, null meaning more
   * than MAX_EXPANSION. Asked of the saved word list when it is current (a plain table: microseconds), else of
   * FTS5, which reads every listed word's document list. A "no" from the saved list is confirmed with FTS5 before
   * the word is corrected, so a word the list missed can never hide a document.
   */
  private lookup(
    term: string,
    withCompletions: boolean,
  ): { exact: boolean; anyCompletion: boolean; completions: string[] | null } {
    const limit = withCompletions ? MAX_EXPANSION + 1 : 2;
    const state = this.stmt(
      'SELECT generation, terms_generation AS termsGeneration FROM search_state WHERE id = 1',
    ).get() as IndexState;
    const fromSaved = state.termsGeneration === state.generation;
    const read = (table: 'search_terms' | 'search_vocab') =>
      this.stmt(`SELECT term FROM ${table} WHERE term >= ? ORDER BY term LIMIT ?`).pluck().all(term, limit) as string[];
    let next = read(fromSaved ? 'search_terms' : 'search_vocab');
    if (fromSaved && next[0] !== term && !next[0]?.startsWith(term)) next = read('search_vocab');
    const starting = next.filter((t) => t.startsWith(term));
    const completions = withCompletions && starting.length <= MAX_EXPANSION ? starting : null;
    return { exact: next[0] === term, anyCompletion: starting.length > 0, completions };
  }

  /**
   * Decides how each word is matched: the last word as a prefix (it may still be being typed), the others whole
   * (or as a prefix when they are no word of their own); a word the index does not hold either way is corrected
   * to the nearest words the vocabulary knows.
   */
  async resolve(terms: string[]): Promise<ResolvedTerm[]> {
    const out: ResolvedTerm[] = [];
    for (let i = 0; i < terms.length; i++) {
      const term = terms[i];
      const mayPrefix = term.length >= MIN_PREFIX_LENGTH;
      const asPrefix = mayPrefix && i === terms.length - 1;
      const vocab = this.vocabulary;
      // Fast paths from memory; everything else is asked of FTS5.
      if (!asPrefix && vocab?.has(term)) {
        out.push({ term, match: 'exact' });
        continue;
      }
      if (asPrefix && term.length <= PREFIX_INDEX_MAX && vocab?.hasPrefix(term)) {
        out.push({ term, match: 'prefix' });
        continue;
      }
      // FTS5 answers prefixes up to PREFIX_INDEX_MAX from its prefix indexes; a longer one is cheaper as its words.
      const long = term.length > PREFIX_INDEX_MAX;
      let found = this.lookup(term, asPrefix && long);
      if (!asPrefix && !found.exact && mayPrefix && long && found.anyCompletion) found = this.lookup(term, true);
      if (found.exact && !asPrefix) out.push({ term, match: 'exact' });
      else if (mayPrefix && found.anyCompletion) {
        const expand = long && found.completions && found.completions.length > 0 ? found.completions : undefined;
        out.push({ term, match: 'prefix', ...(expand ? { expand } : {}) });
      } else if (found.exact) out.push({ term, match: 'exact' });
      else {
        const to = this.stillIndexed(
          (vocab ?? (await this.loadVocabulary().catch(() => null)))?.corrections(term) ?? [],
        );
        out.push(to.length ? { term, match: 'corrected', to } : { term, match: 'none' });
      }
    }
    return out;
  }

  /**
   * The vocabulary only learns words; a word whose every document was since deleted or edited away stays in it
   * (and in the saved list) until a start rebuilds them. So a correction is offered only while FTS5 itself still
   * holds the word: one term look-up per candidate (at most three), on the rare path of a word that needs one.
   */
  private stillIndexed(candidates: string[]): string[] {
    const held = this.stmt('SELECT 1 FROM search_vocab WHERE term = ?').pluck();
    return candidates.filter((t) => held.get(t) !== undefined);
  }

  async search(params: SearchParams): Promise<SearchResult> {
    const { terms } = parseQuery(params.q);
    if (terms.length === 0) return { hits: [], total: 0, totalCapped: false, corrections: [], unmatched: [] };
    const resolved = await this.resolve(terms);
    const corrections = resolved.flatMap((t) => (t.match === 'corrected' ? [{ from: t.term, to: t.to }] : []));
    const unmatched = resolved.flatMap((t) => (t.match === 'none' ? [t.term] : []));
    const match = toMatchExpression(resolved);
    if (!match) return { hits: [], total: 0, totalCapped: false, corrections, unmatched };
    const page = rankPage(this, match, params, params.offset ?? 0, params.limit);
    const details = this.details(page.hits.map((h) => h.docId));
    const highlighter = highlighterFor(resolved);
    const hits: SearchHit[] = [];
    for (const h of page.hits) {
      const d = details.get(h.docId);
      if (!d) continue;
      hits.push({
        type: d.type,
        id: d.refId,
        title: d.title,
        titleHtml: highlightHtml(d.title, highlighter),
        snippet: snippetHtml(snippetText(d), highlighter),
        subsystem: d.subsystem,
        // team-wide guides sit under 'general', which is no subsystem; say it as the guide page does
        subsystemName: d.subsystemName ?? (d.subsystem === 'general' ? 'Team-wide' : null),
        season: d.season,
        seasonId: d.seasonId,
        status: d.status,
        kind: d.kind,
        url: hitUrl(d.type, d.refId),
        titleMatch: h.titleMatch,
        score: Number(h.score.toPrecision(6)),
      });
    }
    return { hits, total: page.total, totalCapped: page.totalCapped, corrections, unmatched };
  }

  private details(ids: number[]): Map<number, DetailRow> {
    if (ids.length === 0) return new Map();
    const rows = this.stmt(
      `SELECT d.id AS docId, d.type AS type, d.ref_id AS refId, d.subsystem AS subsystem, sub.name AS subsystemName,
              d.season_id AS seasonId, s.name AS season, d.status AS status, d.kind AS kind, f.title AS title, f.body AS body,
              c.inputs AS calcInputs, c.notes AS calcNotes
         FROM search_docs d CROSS JOIN search_fts f ON f.rowid = d.id
         LEFT JOIN seasons s ON s.id = d.season_id
         LEFT JOIN subsystems sub ON sub.slug = d.subsystem
         LEFT JOIN calculations c ON d.type = 'calculation' AND c.id = d.ref_id
        WHERE d.id IN (SELECT value FROM json_each(?))`,
    ).all(JSON.stringify(ids)) as DetailRow[];
    return new Map(rows.map((r) => [r.docId, r]));
  }

  /**
   * Makes the guides in the index exactly `guides`. Guides change only with a build, so this runs once per start
   * and writes nothing when the stored fingerprint matches.
   */
  replaceGuides(guides: GuideDoc[], fingerprint: string): boolean {
    const stored = this.stmt("SELECT value FROM search_meta WHERE key = 'guides'").pluck().get() as string | undefined;
    if (stored === fingerprint) return false;
    this.sqlite.transaction(() => {
      this.stmt("DELETE FROM search_fts WHERE rowid IN (SELECT id FROM search_docs WHERE type = 'guide')").run();
      this.stmt("DELETE FROM search_titles WHERE rowid IN (SELECT id FROM search_docs WHERE type = 'guide')").run();
      this.stmt("DELETE FROM search_docs WHERE type = 'guide'").run();
      const doc = this.stmt(
        "INSERT INTO search_docs (type, ref_id, subsystem, season_id, status, kind) VALUES ('guide', ?, ?, NULL, NULL, ?)",
      );
      const words = this.stmt('INSERT INTO search_fts (rowid, title, body) VALUES (?, ?, ?)');
      const title = this.stmt('INSERT INTO search_titles (rowid, title) VALUES (?, ?)');
      for (const g of guides) {
        const { lastInsertRowid } = doc.run(g.slug, g.subsystem, g.audience);
        words.run(lastInsertRowid, g.title, g.text);
        title.run(lastInsertRowid, g.title);
      }
      this.stmt(
        "INSERT INTO search_meta (key, value) VALUES ('guides', ?) ON CONFLICT (key) DO UPDATE SET value = excluded.value",
      ).run(fingerprint);
      this.stmt('UPDATE search_state SET generation = generation + 1 WHERE id = 1').run();
    })();
    this.noteText(guides.map((g) => `${g.title} ${g.text}`).join('\n'));
    return true;
  }
}
