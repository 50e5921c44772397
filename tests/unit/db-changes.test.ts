// What counts as a change for the response cache: per table, through triggers, and everything at once for
// anything that cannot be pinned to a table.
import { describe, it, expect, beforeAll } from 'vitest';
import Database from 'better-sqlite3';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  currentVersions,
  dependencies,
  instrumentConnection,
  readingInto,
  stillValid,
} from '../../src/lib/server/db/changes';

let db: Database.Database;
let file: string;

beforeAll(() => {
  file = join(mkdtempSync(join(tmpdir(), 'wakebook-changes-')), 'c.db');
  db = new Database(file);
  db.pragma('journal_mode = WAL');
  db.exec(`
    create table notes (id integer primary key, body text);
    create table tags (id integer primary key, name text);
    create table note_log (id integer primary key, note_id integer);
    create trigger notes_logged after insert on notes begin insert into note_log (note_id) values (new.id); end;
    create virtual table words using fts5(body);
    create virtual table words_vocab using fts5vocab(words, 'row');
  `);
  instrumentConnection(db);
});

/** Reads with `sql` inside a scope and returns what the answer depends on. */
function depsOf(sql: string) {
  const start = currentVersions();
  const read = new Set<string>();
  readingInto(read, () => db.prepare(sql).all());
  return { deps: dependencies(start, read), read };
}

describe('table versions', () => {
  it('records the tables a read names, including joins', () => {
    const { read } = depsOf('select n.body, t.name from notes n join tags t on t.id = n.id');
    expect([...read].sort()).toEqual(['notes', 'tags']);
  });

  it('a write to one table leaves answers that read only others valid', () => {
    const tagsOnly = depsOf('select * from tags').deps;
    const notes = depsOf('select * from notes').deps;
    db.prepare('insert into notes (body) values (?)').run('hello');
    expect(stillValid(tagsOnly)).toBe(true);
    expect(stillValid(notes)).toBe(false);
  });

  it('a write reaches the tables its triggers write', () => {
    const log = depsOf('select count(*) from note_log').deps;
    db.prepare('insert into notes (body) values (?)').run('again');
    expect(stillValid(log)).toBe(false);
  });

  it('a vocabulary table depends on the index it reads', () => {
    const vocab = depsOf('select term from words_vocab').deps;
    db.prepare('insert into words (body) values (?)').run('propeller');
    expect(stillValid(vocab)).toBe(false);
  });

  it('exec, schema changes and unknown statements invalidate everything', () => {
    const a = depsOf('select * from tags').deps;
    db.exec('create table later (x)');
    expect(stillValid(a)).toBe(false);
    const b = depsOf('select * from tags').deps;
    db.prepare('create index tags_name on tags (name)').run();
    expect(stillValid(b)).toBe(false);
  });

  it('a write by another connection (another process) invalidates everything', () => {
    const a = depsOf('select * from tags').deps;
    const other = new Database(file);
    other.prepare('insert into notes (body) values (?)').run('from elsewhere');
    other.close();
    expect(stillValid(a)).toBe(false);
  });

  it('reads outside a scope are not recorded and plain reads change nothing', () => {
    const a = depsOf('select * from tags').deps;
    db.prepare('select * from notes').all();
    db.prepare('with x as (select 1) select * from x').all();
    expect(stillValid(a)).toBe(true);
  });
});
