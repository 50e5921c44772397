import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, demoAccounts, type DemoRole } from '../setup/db';
import * as searchRoute from '../../src/pages/api/search';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as status from '../../src/pages/api/records/[id]/status';
import * as calculationsRoute from '../../src/pages/api/calculations/index';
import * as seasonsRoute from '../../src/pages/api/seasons/index';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

interface Hit {
  type: string;
  id: string;
  title: string;
  snippet: string;
  subsystem: string;
  season: string | null;
  status: string | null;
  url: string;
  score: number;
}

async function search(params: Record<string, string | number>, role: DemoRole = 'member') {
  const query = Object.fromEntries(Object.entries(params).map(([k, v]) => [k, String(v)]));
  const res = await call(searchRoute, 'GET', { session: s[role], query });
  expect(res.status, res.text).toBe(200);
  return res.body as {
    hits: Hit[];
    total: number;
    totalCapped: boolean;
    corrections: { from: string; to: string[] }[];
    unmatched: string[];
    tookMs: number;
  };
}

const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

describe('GET /api/search', () => {
  it('401 signed out; 200 for every role with the API.md shape', async () => {
    const out = await call(searchRoute, 'GET', { query: { q: 'propeller' } });
    expect(out.status).toBe(401);
    expect(out.body.error.code).toBe('unauthenticated');
    for (const role of Object.keys(demoAccounts) as DemoRole[]) {
      const body = await search({ q: 'propeller' }, role);
      expect(body.hits.length).toBeGreaterThan(0);
      expect(typeof body.total).toBe('number');
      expect(typeof body.tookMs).toBe('number');
      for (const h of body.hits) {
        expect(Object.keys(h)).toEqual(
          expect.arrayContaining(['type', 'id', 'title', 'snippet', 'subsystem', 'season', 'url', 'score']),
        );
        expect(['guide', 'decision', 'lesson', 'calculation']).toContain(h.type);
      }
    }
  });

  it('finds the demo team’s guides, records and calculations: words, prefixes and typos', async () => {
    const propeller = await search({ q: 'propeller', limit: 50 });
    const types = new Set(propeller.hits.map((h) => h.type));
    for (const t of ['guide', 'decision', 'calculation']) expect(types).toContain(t);
    expect(propeller.hits.map((h) => h.id)).toContain('reading-an-open-water-diagram');
    expect(propeller.hits.map((h) => h.id)).toContain('demo-rec-2526-two-propellers');
    // Results come in rank order.
    const titleFirst = propeller.hits.findIndex((h) => !/propeller/i.test(h.title));
    expect(propeller.hits.slice(0, Math.max(1, titleFirst)).every((h) => /propeller/i.test(h.title))).toBe(true);

    const typo = await search({ q: 'propeler' });
    expect(typo.corrections).toEqual([{ from: 'propeler', to: ['propeller'] }]);
    expect(typo.hits.length).toBeGreaterThan(0);
    for (const h of typo.hits as (Hit & { titleHtml: string })[]) {
      expect(propeller.hits.map((p) => p.id)).toContain(h.id);
      expect((h.titleHtml + h.snippet).toLowerCase()).toContain('<mark>propeller</mark>');
    }

    const prefix = await search({ q: 'vent', limit: 50 });
    expect(prefix.hits.map((h) => h.id)).toEqual(
      expect.arrayContaining(['demo-rec-2425-prop-ventilation-slalom', 'demo-rec-2526-sprint-prop-ventilation-launch']),
    );
    expect(prefix.hits.some((h) => /<mark>Ventilation<\/mark>|<mark>ventilat/i.test(h.snippet + h.title))).toBe(true);
  });

  it('filters by type, subsystem and season (by id or by name)', async () => {
    const guides = await search({ q: 'propeller', type: 'guide', limit: 50 });
    expect(guides.hits.length).toBeGreaterThan(0);
    expect(guides.hits.every((h) => h.type === 'guide' && h.url.startsWith('/guides/'))).toBe(true);
    const battery = await search({ q: 'cell', subsystem: 'battery', limit: 50 });
    expect(battery.hits.length).toBeGreaterThan(0);
    expect(battery.hits.every((h) => h.subsystem === 'battery')).toBe(true);
    const seasons = (await call(seasonsRoute, 'GET', { session: s.member })).body.seasons as {
      id: string;
      name: string;
    }[];
    const past = seasons.find((x) => x.name === '2024–25')!;
    const byName = await search({ q: 'propeller', season: '2024–25', limit: 50 });
    const byId = await search({ q: 'propeller', season: past.id, limit: 50 });
    expect(byName.hits.length).toBeGreaterThan(0);
    expect(byName.hits.every((h) => h.season === '2024–25')).toBe(true);
    expect(byId.hits.map((h) => h.id)).toEqual(byName.hits.map((h) => h.id));
    expect((await search({ q: 'propeller', season: 'no-such-season' })).hits).toEqual([]);
  });

  it('snippets mark the matched words and carry no markup from the text', async () => {
    const res = await search({ q: 'ventilation', limit: 20 });
    expect(res.hits.some((h) => h.snippet.includes('<mark>'))).toBe(true);
    for (const h of res.hits) expect(h.snippet.replace(/<\/?mark>/g, '')).not.toMatch(/[<>]/);
  });

  it('odd queries answer 200 or 400, never 5xx', async () => {
    const odd = [
      '',
      ' ',
      'a',
      '"',
      '""',
      '"unbalanced',
      'AND',
      'OR NOT',
      'NEAR(prop vent, 2)',
      '*',
      'prop*',
      '^prop',
      'title:prop',
      '{title}: x',
      '-',
      'prop -vent',
      '(((',
      ')',
      '\\',
      '\u0000',
      '\u200b',
      '🚤⚡',
      'שלום',
      '日本語',
      'Ｆｕｌｌ',
      'naïve café',
      '%',
      "'; DROP TABLE records; --",
      'x'.repeat(499),
      'x '.repeat(250),
      'x'.repeat(5000),
    ];
    for (const q of odd) {
      const res = await call(searchRoute, 'GET', { session: s.member, query: { q } });
      expect([200, 400], JSON.stringify(q.slice(0, 30))).toContain(res.status);
      if (res.status === 400) expect(res.body.error.code).toBe('invalid_input');
    }
    expect((await call(searchRoute, 'GET', { session: s.member, query: { q: 'x'.repeat(5000) } })).status).toBe(400);
    const bad: Record<string, string>[] = [
      { q: 'prop', type: 'memo' },
      { q: 'prop', limit: '0' },
      { q: 'prop', limit: '500' },
      { q: 'prop', offset: '-1' },
      { q: 'prop', subsystem: '../x' },
    ];
    for (const query of bad) {
      const res = await call(searchRoute, 'GET', { session: s.member, query });
      expect(res.status, JSON.stringify(query)).toBe(400);
    }
    // The tables are still there.
    expect((await search({ q: 'propeller' })).hits.length).toBeGreaterThan(0);
  });
});

describe('fresh after writes through the real routes', () => {
  it('a new record is found at once, also by a typo of its new word; an edit moves it to its new words', async () => {
    const created = await call(recordsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'decision',
        title: 'Quokkaline coating for the pod',
        subsystem: 'propulsion',
        body: doc('The zanthoxylum primer keeps weed off the pod.'),
      },
    });
    expect(created.status).toBe(201);
    const id = created.body.record.id as string;
    expect((await search({ q: 'quokkaline' })).hits.map((h) => h.id)).toEqual([id]);
    expect((await search({ q: 'zanthoxylum' })).hits.map((h) => h.id)).toEqual([id]);
    const typo = await search({ q: 'zanthoxilum' });
    expect(typo.corrections[0]?.to).toContain('zanthoxylum');
    expect(typo.hits.map((h) => h.id)).toEqual([id]);

    const edited = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id },
      body: { version: 1, title: 'Wallabine coating for the pod' },
    });
    expect(edited.status).toBe(200);
    expect((await search({ q: 'quokkaline' })).hits).toEqual([]);
    expect((await search({ q: 'wallabine' })).hits.map((h) => h.id)).toEqual([id]);
  });

  it('superseding shows in the results straight away', async () => {
    const make = async (title: string) => {
      const r = await call(recordsRoute, 'POST', {
        session: s.member,
        body: { kind: 'decision', title, subsystem: 'battery', body: doc('Fuse rating for the marsupial harness.') },
      });
      expect(r.status).toBe(201);
      return r.body.record.id as string;
    };
    // Acceptance needs an advisor or a lead (or their review); a decision is replaced only by an accepted one.
    const proposeAndAccept = async (id: string) => {
      expect(
        (await call(status, 'POST', { session: s.member, params: { id }, body: { status: 'proposed' } })).status,
      ).toBe(200);
      expect(
        (await call(status, 'POST', { session: s.advisor, params: { id }, body: { status: 'accepted' } })).status,
      ).toBe(200);
    };
    const old = await make('Marsupial harness fuse 60 A');
    await proposeAndAccept(old);
    const newer = await make('Marsupial harness fuse 80 A');
    await proposeAndAccept(newer);
    expect(
      (
        await call(status, 'POST', {
          session: s.member,
          params: { id: old },
          body: { status: 'superseded', supersededBy: newer },
        })
      ).status,
    ).toBe(200);
    const hits = (await search({ q: 'marsupial harness' })).hits;
    expect(hits.find((h) => h.id === old)?.status).toBe('superseded');
    expect(hits.find((h) => h.id === newer)?.status).toBe('accepted');
  });

  it('a saved calculation is found by its title and notes', async () => {
    const res = await call(calculationsRoute, 'POST', {
      session: s.member,
      body: {
        kind: 'cable',
        title: 'Bilge pump feeder',
        subsystem: 'battery',
        notes: 'Numbat loom run from the fuse box.',
        inputs: { current_A: 10, length_m: 3, crossSection_mm2: 2.5, temperature_C: 20, systemVoltage_V: 48 },
      },
    });
    expect(res.status, res.text).toBe(201);
    const id = res.body.calculation.id as string;
    const hits = (await search({ q: 'numbat', type: 'calculation' })).hits;
    expect(hits).toHaveLength(1);
    expect(hits[0]).toMatchObject({ id, type: 'calculation', url: `/calculations/${id}`, subsystem: 'battery' });
    expect((await search({ q: 'numbatt' })).corrections[0]?.to).toContain('numbat');
  });
});
