import { describe, it, expect, beforeEach } from 'vitest';
import type Database from 'better-sqlite3';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '../../../src/lib/server/db/client';
import { SearchEngine } from '../../../src/lib/server/search/engine';
import { BROAD } from '../../../src/lib/server/search/rank';

// Each test gets its own database with the real migrations, so the real triggers keep the index.
let sqlite: Database.Database;
let engine: SearchEngine;
let n = 0;

beforeEach(() => {
  sqlite = openDatabase(join(mkdtempSync(join(tmpdir(), 'wakebook-search-')), 'search.db')).$client;
  const now = Date.now();
  sqlite
    .prepare(
      "INSERT INTO seasons (id, name, starts_on, ends_on, phase, is_current, created_at) VALUES ('s25', '2025–26', '2025-09-01', '2026-08-31', 'build', 1, ?)",
    )
    .run(now);
  sqlite
    .prepare(
      "INSERT INTO seasons (id, name, starts_on, ends_on, phase, is_current, created_at) VALUES ('s24', '2024–25', '2024-09-01', '2025-08-31', 'handover', 0, ?)",
    )
    .run(now);
  for (const [slug, name] of [
    ['propulsion', 'Propulsion'],
    ['battery', 'Battery'],
    ['hull', 'Hull'],
  ]) {
    sqlite.prepare('INSERT INTO subsystems (slug, name, created_at) VALUES (?, ?, ?)').run(slug, name, now);
  }
  engine = new SearchEngine(sqlite);
});

function addRecord(r: {
  title: string;
  body: string;
  kind?: 'decision' | 'lesson';
  subsystem?: string;
  season?: string;
  status?: string;
}): string {
  const id = `rec${++n}`;
  const now = Date.now();
  sqlite
    .prepare(
      "INSERT INTO records (id, kind, title, subsystem_slug, season_id, status, body, body_text, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, '{}', ?, ?, ?)",
    )
    .run(
      id,
      r.kind ?? 'decision',
      r.title,
      r.subsystem ?? 'propulsion',
      r.season ?? 's25',
      r.status ?? (r.kind === 'lesson' ? 'open' : 'draft'),
      r.body,
      now,
      now,
    );
  return id;
}

function addCalculation(title: string, notes: string, inputs: object, subsystem = 'propulsion'): string {
  const id = `calc${++n}`;
  const now = Date.now();
  sqlite
    .prepare(
      "INSERT INTO calculations (id, kind, title, subsystem_slug, season_id, notes, inputs, created_at, updated_at) VALUES (?, 'propeller', ?, ?, 's25', ?, ?, ?, ?)",
    )
    .run(id, title, subsystem, notes, JSON.stringify(inputs), now, now);
  return id;
}

const ids = async (q: string, more: object = {}) =>
  (await engine.search({ q, limit: 20, ...more })).hits.map((h) => h.id);

describe('adding, replacing and removing documents (the triggers)', () => {
  it('finds a new record by title and body words, with its facts, link and a marked snippet', async () => {
    const id = addRecord({
      title: 'Two propellers for Tern 5',
      body: 'The sprint propeller ventilated at launch; the endurance one did not.',
    });
    const r = await engine.search({ q: 'ventilated', limit: 5 });
    expect(r.total).toBe(1);
    expect(r.hits[0]).toMatchObject({
      id,
      type: 'decision',
      url: `/records/${id}`,
      subsystem: 'propulsion',
      subsystemName: 'Propulsion',
      season: '2025–26',
      seasonId: 's25',
      status: 'draft',
      titleMatch: false,
    });
    expect(r.hits[0].snippet).toContain('<mark>ventilated</mark>');
    expect(r.hits[0].score).toBeGreaterThan(0);
    expect(await ids('two propellers')).toEqual([id]);
  });

  it('an edit replaces the words: the old ones no longer find it, the new ones do', async () => {
    const id = addRecord({ title: 'Shaft seal', body: 'Grease the lip seal every outing.' });
    sqlite
      .prepare("UPDATE records SET title = 'Stern gland', body_text = 'Packing replaced by a face seal.' WHERE id = ?")
      .run(id);
    expect(await ids('grease')).toEqual([]);
    expect(await ids('shaft')).toEqual([]);
    expect(await ids('packing')).toEqual([id]);
    expect(await ids('gland')).toEqual([id]);
  });

  it('a deleted record leaves the index, a restored one comes back; a hard delete removes every trace', async () => {
    const id = addRecord({ title: 'Kill cord test', body: 'Pull the cord at full throttle.' });
    sqlite.prepare('UPDATE records SET deleted_at = ? WHERE id = ?').run(Date.now(), id);
    expect(await ids('cord')).toEqual([]);
    sqlite.prepare('UPDATE records SET deleted_at = NULL WHERE id = ?').run(id);
    expect(await ids('cord')).toEqual([id]);
    sqlite.prepare('DELETE FROM records WHERE id = ?').run(id);
    expect(await ids('cord')).toEqual([]);
    expect(sqlite.prepare('SELECT count(*) FROM search_docs').pluck().get()).toBe(0);
    expect(sqlite.prepare('SELECT count(*) FROM search_fts').pluck().get()).toBe(0);
    expect(sqlite.prepare('SELECT count(*) FROM search_titles').pluck().get()).toBe(0);
  });

  it('a status change shows in the hit at once', async () => {
    const id = addRecord({ title: 'Single string array', body: 'One MPPT for the whole array.' });
    sqlite.prepare("UPDATE records SET status = 'superseded' WHERE id = ?").run(id);
    expect((await engine.search({ q: 'mppt', limit: 5 })).hits[0]).toMatchObject({ id, status: 'superseded' });
  });

  it('indexes a calculation by title, notes, calculator kind, input names and text values, not numbers', async () => {
    const id = addCalculation('Endurance propeller, sea trial', 'Checked against the tank data.', {
      blades: 3,
      diameter_m: 0.2,
      water: 'sea',
    });
    expect(await ids('tank')).toEqual([id]);
    expect(await ids('diameter')).toEqual([id]);
    expect(await ids('sea')).toEqual([id]);
    expect(await ids('propeller', { type: 'calculation' })).toEqual([id]);
    expect((await engine.search({ q: 'tank', limit: 1 })).hits[0]).toMatchObject({
      type: 'calculation',
      kind: 'propeller',
      url: `/calculations/${id}`,
    });
    expect(await ids('3')).toEqual([]);
  });
});

describe('filters and order', () => {
  it('filters by type, subsystem and season, alone and together', async () => {
    const a = addRecord({ title: 'Cell balancing', body: 'Balance the pack monthly.', subsystem: 'battery' });
    const b = addRecord({
      title: 'Cell drift lesson',
      body: 'One cell drifted: balance more often.',
      kind: 'lesson',
      subsystem: 'battery',
      season: 's24',
    });
    const c = addRecord({ title: 'Hull balance', body: 'Trim and balance the hull.', subsystem: 'hull' });
    expect((await ids('balance')).sort()).toEqual([a, b, c].sort());
    expect(await ids('balance', { type: 'lesson' })).toEqual([b]);
    expect((await ids('balance', { subsystem: 'battery' })).sort()).toEqual([a, b].sort());
    expect(await ids('balance', { seasonId: 's24' })).toEqual([b]);
    expect(await ids('balance', { subsystem: 'battery', seasonId: 's25', type: 'decision' })).toEqual([a]);
    expect(await ids('balance', { type: 'guide' })).toEqual([]);
  });

  it('puts documents with every word in the title first, then the rest by BM25', async () => {
    const body = addRecord({
      title: 'Weekly checks',
      body: 'Look at the cooling pump and the cooling hoses; cooling matters.',
    });
    const title = addRecord({ title: 'Cooling pump choice', body: 'We chose a bigger one.' });
    const r = await engine.search({ q: 'cooling pump', limit: 5 });
    expect(r.hits.map((h) => h.id)).toEqual([title, body]);
    expect(r.hits.map((h) => h.titleMatch)).toEqual([true, false]);
    expect(r.hits[0].titleHtml).toBe('<mark>Cooling</mark> <mark>pump</mark> choice');
  });

  it('pages with offset and limit without repeating a hit', async () => {
    const all = Array.from({ length: 7 }, (_, i) => addRecord({ title: `Log ${i}`, body: `telemetry sample ${i}` }));
    const first = await ids('telemetry', { limit: 4 });
    const second = await ids('telemetry', { limit: 4, offset: 4 });
    expect(first).toHaveLength(4);
    expect([...first, ...second].sort()).toEqual(all.sort());
  });

  it('pages across the two tiers: title matches first, then the rest, none twice', async () => {
    const titled = [0, 1, 2].map((i) => addRecord({ title: `Strut fairing ${i}`, body: 'Shape notes.' }));
    const bodies = [0, 1, 2, 3].map((i) => addRecord({ title: `Note ${i}`, body: 'The strut was faired.' }));
    const pages = [];
    for (let offset = 0; offset < 8; offset += 2)
      pages.push(...(await engine.search({ q: 'strut', limit: 2, offset })).hits);
    expect(pages.map((h) => h.id).sort()).toEqual([...titled, ...bodies].sort());
    expect(pages.map((h) => h.titleMatch)).toEqual([true, true, true, false, false, false, false]);
  });

  it(`a query matching more than ${BROAD} documents reports "at least ${BROAD}" and still puts an old title match first`, async () => {
    const old = addRecord({ title: 'Rudder stock sizing', body: 'An early note.' });
    sqlite.transaction(() => {
      for (let i = 0; i < BROAD + 20; i++) addRecord({ title: `Note ${i}`, body: 'The rudder was checked.' });
    })();
    const r = await engine.search({ q: 'rudder', limit: 5 });
    expect(r.totalCapped).toBe(true);
    expect(r.total).toBe(BROAD);
    expect(r.hits[0].id).toBe(old);
    expect(r.hits).toHaveLength(5);
  });
});

describe('words: prefixes, typos and odd input', () => {
  it('matches the last word as a prefix, short and long', async () => {
    const id = addRecord({ title: 'Prop ventilation at launch', body: 'Air drawn down from the surface.' });
    expect(await ids('vent')).toEqual([id]);
    expect(await ids('ventilat')).toEqual([id]);
    expect(await ids('launch ve')).toEqual([id]);
    expect((await engine.resolve(['ventilat']))[0]).toEqual({
      term: 'ventilat',
      match: 'prefix',
      expand: ['ventilation'],
    });
  });

  it('matches earlier words whole, or as a prefix when they are no word of their own', async () => {
    const id = addRecord({ title: 'Vent hose routing', body: 'Route the ventilation hose high.' });
    expect(await engine.resolve(['vent', 'hose'])).toEqual([
      { term: 'vent', match: 'exact' },
      { term: 'hose', match: 'prefix' },
    ]);
    expect((await engine.resolve(['routi', 'hose']))[0]).toMatchObject({ term: 'routi', match: 'prefix' });
    expect(await ids('routi hose')).toEqual([id]);
  });

  it('corrects a word the index lacks to the nearest one it holds, and says so', async () => {
    const id = addRecord({ title: 'Propeller pitch', body: 'Pitch ratio of 1.1 for the endurance race.' });
    const r = await engine.search({ q: 'propeler pitch', limit: 5 });
    expect(r.hits.map((h) => h.id)).toEqual([id]);
    expect(r.corrections).toEqual([{ from: 'propeler', to: ['propeller'] }]);
    expect(r.hits[0].titleHtml).toContain('<mark>Propeller</mark>');
  });

  it('answers nothing, naming the word, when a word has no near match', async () => {
    addRecord({ title: 'Propeller pitch', body: 'Pitch ratio.' });
    const r = await engine.search({ q: 'pitch qwxzvbn', limit: 5 });
    expect(r).toMatchObject({ hits: [], total: 0, unmatched: ['qwxzvbn'] });
  });

  it('never throws on odd input', async () => {
    addRecord({ title: 'Propeller "and" near', body: 'Title body text * ^ : -' });
    for (const q of [
      '',
      ' ',
      'a',
      '"',
      'AND',
      'NEAR(a b)',
      '*',
      '-',
      '^',
      ':',
      'title:x',
      '(((',
      '\u0000',
      '🚤',
      'x'.repeat(5000),
      'ünïcödé',
    ]) {
      const r = await engine.search({ q, limit: 5 });
      expect(Array.isArray(r.hits), q.slice(0, 20)).toBe(true);
    }
  });
});

describe('guides', () => {
  const guide = (slug: string, title: string, text: string) => ({
    slug,
    title,
    subsystem: 'propulsion',
    audience: 'everyone',
    text,
  });

  it('indexes the guides of a build once, and replaces them when they change', async () => {
    expect(
      engine.replaceGuides(
        [guide('open-water', 'Reading an open-water diagram', 'Thrust and torque coefficients.')],
        'v1',
      ),
    ).toBe(true);
    expect(
      engine.replaceGuides(
        [guide('open-water', 'Reading an open-water diagram', 'Thrust and torque coefficients.')],
        'v1',
      ),
    ).toBe(false);
    expect((await engine.search({ q: 'torque', limit: 5 })).hits[0]).toMatchObject({
      type: 'guide',
      id: 'open-water',
      url: '/guides/open-water',
      season: null,
    });
    engine.replaceGuides([guide('motor-basics', 'Motor basics', 'Back-EMF and torque.')], 'v2');
    expect(await ids('torque')).toEqual(['motor-basics']);
    expect(await ids('coefficients')).toEqual([]);
  });
});

describe('the vocabulary across restarts', () => {
  it('is saved, read back by a new engine, and rebuilt when the index changed behind its back', async () => {
    addRecord({ title: 'Contactor welding', body: 'The contactor welded shut under precharge current.' });
    await engine.settled();
    const state = () =>
      sqlite.prepare('SELECT generation, terms_generation AS saved FROM search_state').get() as {
        generation: number;
        saved: number;
      };
    expect(state().saved).toBe(state().generation);

    const restarted = new SearchEngine(sqlite);
    expect((await restarted.search({ q: 'contacter', limit: 5 })).corrections).toEqual([
      { from: 'contacter', to: ['contactor'] },
    ]);

    // A write the engine was not told about (as the demo seed does) makes the saved copy stale.
    addRecord({ title: 'Busbar torque', body: 'Torque the busbar bolts to spec.' });
    expect(state().saved).toBeLessThan(state().generation);
    const again = new SearchEngine(sqlite);
    await again.settled();
    expect(state().saved).toBe(state().generation);
    expect((await again.search({ q: 'busbra', limit: 5 })).corrections).toEqual([{ from: 'busbra', to: ['busbar'] }]);
  });

  it('a word missing from the saved word list is still found: FTS5 has the last word', async () => {
    const id = addRecord({ title: 'Anemometer mast', body: 'Wind speed logged at the dock.' });
    await engine.settled();
    sqlite.prepare("DELETE FROM search_terms WHERE term = 'anemometer'").run();
    expect(await ids('anemometer')).toEqual([id]);
    expect(await ids('anemometer wind')).toEqual([id]);
    expect((await engine.search({ q: 'anemometer', limit: 1 })).corrections).toEqual([]);
  });

  it('learns no word from a deleted record or calculation', async () => {
    addRecord({ title: 'Solar array', body: 'Tilting frame.' });
    await engine.settled();
    // Deleted by another connection before this engine heard of them; the change hook then tells it.
    const rec = addRecord({ title: 'Zeppelin mooring', body: 'A mooring mast.' });
    const calc = addCalculation('Gondola thrust', 'Dirigible gondola.', { blades: 3 });
    sqlite.prepare('UPDATE records SET deleted_at = ? WHERE id = ?').run(Date.now(), rec);
    sqlite.prepare('UPDATE calculations SET deleted_at = ? WHERE id = ?').run(Date.now(), calc);
    engine.noteChanged('record', rec);
    engine.noteChanged('calculation', calc);
    for (const q of ['zepelin', 'gondolla', 'dirigable']) {
      const r = await engine.search({ q, limit: 5 });
      expect(r.hits).toEqual([]);
      expect(r.corrections).toEqual([]);
    }
    const saved = sqlite.prepare("SELECT term FROM search_terms WHERE term IN ('zeppelin', 'gondola')").pluck().all();
    expect(saved).toEqual([]);
  });

  it('never offers a correction that only a since deleted record held', async () => {
    await engine.settled();
    const id = addRecord({ title: 'Zeppelin mooring', body: 'A mooring mast.' });
    engine.noteChanged('record', id);
    expect((await engine.search({ q: 'zepelin', limit: 5 })).corrections).toEqual([
      { from: 'zepelin', to: ['zeppelin'] },
    ]);
    sqlite.prepare('UPDATE records SET deleted_at = ? WHERE id = ?').run(Date.now(), id);
    engine.noteChanged('record', id);
    const r = await engine.search({ q: 'zepelin', limit: 5 });
    expect(r.corrections).toEqual([]);
    expect(r.unmatched).toEqual(['zepelin']);
  });

  it('learns the words of a write it is told about, and keeps the saved copy current', async () => {
    addRecord({ title: 'Solar array', body: 'Tilting frame.' });
    await engine.settled();
    const id = addRecord({ title: 'Irradiance logging', body: 'A pyranometer on the mast.' });
    engine.noteChanged('record', id);
    expect((await engine.search({ q: 'pyranometr', limit: 5 })).hits.map((h) => h.id)).toEqual([id]);
    const s = sqlite.prepare('SELECT generation, terms_generation AS saved FROM search_state').get() as {
      generation: number;
      saved: number;
    };
    expect(s.saved).toBe(s.generation);
  });
});
