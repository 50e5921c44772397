import { describe, it, expect } from 'vitest';
import Database from 'better-sqlite3';
import {
  parseQuery,
  toMatchExpression,
  highlighterFor,
  MAX_TERMS,
  type ResolvedTerm,
} from '../../../src/lib/server/search/query';
import { tokenize, foldCase } from '../../../src/lib/server/search/tokens';

// Strings people paste or type by accident, and FTS5 query syntax that must be read as plain words.
const HOSTILE = [
  '',
  ' ',
  'a',
  '"',
  '""',
  '"unbalanced',
  "it's",
  'AND',
  'OR',
  'NOT',
  'NEAR',
  'NEAR(prop vent, 3)',
  'prop AND',
  'AND prop',
  '*',
  'prop*',
  '^prop',
  'title:prop',
  '{title body}: prop',
  '- prop',
  'prop -vent',
  '(((',
  ')',
  'a OR b NOT c',
  '+',
  '\\',
  'ventilation\u0000',
  '\u200b',
  '🚤⚡',
  'שלום',
  '日本語のテキスト',
  'Ｆｕｌｌｗｉｄｔｈ',
  'naïve café',
  'x'.repeat(5000),
  Array.from({ length: 50 }, (_, i) => `w${i}`).join(' '),
];

describe('parseQuery', () => {
  it('keeps letters and digits as lower-case terms without diacritics, drops punctuation and duplicates', () => {
    expect(parseQuery('Propeller "ventilation" at LAUNCH, propeller!').terms).toEqual([
      'propeller',
      'ventilation',
      'at',
      'launch',
    ]);
    expect(parseQuery('naïve Café').terms).toEqual(['naive', 'cafe']);
    expect(parseQuery('6 mm² cable').terms).toEqual(['6', 'mm²', 'cable']);
  });

  it('reads FTS5 operators as words and never passes syntax through', () => {
    expect(parseQuery('prop AND NEAR(vent, 3) -y ^z*').terms).toEqual(['prop', 'and', 'near', 'vent', '3', 'y', 'z']);
    expect(parseQuery('title:x {body}:"y" OR NOT').terms).toEqual(['title', 'x', 'body', 'y', 'or', 'not']);
  });

  it('caps the number and length of terms', () => {
    expect(parseQuery(Array.from({ length: 50 }, (_, i) => `w${i}`).join(' ')).terms).toHaveLength(MAX_TERMS);
    expect(parseQuery('x'.repeat(5000)).terms).toEqual([]);
  });

  it('tokenizes like FTS5 unicode61 with remove_diacritics 2', () => {
    const db = new Database(':memory:');
    db.exec(
      "CREATE VIRTUAL TABLE t USING fts5(x, tokenize = 'unicode61 remove_diacritics 2'); CREATE VIRTUAL TABLE v USING fts5vocab(t, 'row');",
    );
    const text = 'Naïve café: the Tern-5 pod’s 6 mm² cable, 48 V; Ölkühler Øresund ÉTÉ señor';
    db.prepare('INSERT INTO t (x) VALUES (?)').run(text);
    const fts = (db.prepare('SELECT term FROM v ORDER BY term').pluck().all() as string[]).sort();
    expect([...new Set(tokenize(text))].sort()).toEqual(fts);
    expect(foldCase('ÉTÉ')).toBe('ete');
  });
});

describe('toMatchExpression', () => {
  it('quotes every term and joins with AND; prefixes, expansions and corrections have their own forms', () => {
    const terms: ResolvedTerm[] = [
      { term: 'shaft', match: 'exact' },
      { term: 'vent', match: 'prefix' },
      { term: 'propel', match: 'prefix', expand: ['propeller', 'propellers'] },
      { term: 'sael', match: 'corrected', to: ['seal', 'sail'] },
    ];
    expect(toMatchExpression(terms)).toBe(
      '"shaft" AND "vent"* AND ("propeller" OR "propellers") AND ("seal" OR "sail")',
    );
  });

  it('is null when there is nothing to search or a word matches nothing', () => {
    expect(toMatchExpression([])).toBeNull();
    expect(
      toMatchExpression([
        { term: 'shaft', match: 'exact' },
        { term: 'qqq', match: 'none' },
      ]),
    ).toBeNull();
  });

  it('never makes an expression FTS5 rejects, whatever was typed', () => {
    const db = new Database(':memory:');
    db.exec('CREATE VIRTUAL TABLE t USING fts5(title, body)');
    db.prepare('INSERT INTO t (title, body) VALUES (?, ?)').run('Prop and vent', 'near the title body');
    const run = db.prepare('SELECT count(*) FROM t WHERE t MATCH ?').pluck();
    for (const raw of HOSTILE) {
      const terms = parseQuery(raw).terms;
      const asExact = toMatchExpression(terms.map((term) => ({ term, match: 'exact' as const })));
      const asPrefix = toMatchExpression(terms.map((term) => ({ term, match: 'prefix' as const })));
      for (const expr of [asExact, asPrefix]) if (expr) expect(() => run.get(expr), raw.slice(0, 40)).not.toThrow();
    }
    // The words themselves are searched: "and" and "near" are ordinary terms here.
    expect(
      run.get(toMatchExpression(parseQuery('AND NEAR').terms.map((term) => ({ term, match: 'exact' as const })))!),
    ).toBe(1);
  });
});

describe('highlighterFor', () => {
  it('marks exact words, native prefixes, expansions and corrections', () => {
    const h = highlighterFor([
      { term: 'shaft', match: 'exact' },
      { term: 'ven', match: 'prefix' },
      { term: 'propel', match: 'prefix', expand: ['propeller'] },
      { term: 'sael', match: 'corrected', to: ['seal'] },
      { term: 'zzz', match: 'none' },
    ]);
    expect([...h.exact].sort()).toEqual(['propeller', 'seal', 'shaft']);
    expect(h.prefixes).toEqual(['ven']);
  });
});
