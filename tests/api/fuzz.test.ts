// Bad input: a seeded random-input test of every write route that reads a body (found from the route files),
// ≥ 200 bodies each — wrong types, huge strings, deep nesting, odd Unicode, prototype-pollution keys, broken JSON.
// Every answer must be 4xx, carry no stack or internals, and a refused request must change no stored data.
import { describe, it, expect, beforeAll } from 'vitest';
import type { APIRoute } from 'astro';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import { db } from '../../src/lib/server/db/client';
import { listSeasons } from '../../src/lib/server/seasons';
import { listPeople } from '../../src/lib/server/people';

type Method = 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type FieldType = 'string' | 'number' | 'boolean' | 'array' | 'object';
const modules = import.meta.glob<Partial<Record<Method, APIRoute>>>('../../src/pages/api/**/*.ts', { eager: true });
const sources = import.meta.glob<string>('../../src/pages/api/**/*.ts', {
  eager: true,
  query: '?raw',
  import: 'default',
});

/** Each body-reading route's own fields, so that every object body gives at least one of them a wrong type. */
const FIELDS: Record<string, Record<string, FieldType>> = {
  'POST /api/auth/sign-in': { email: 'string', password: 'string' },
  'POST /api/auth/accept-invitation': { token: 'string', password: 'string', name: 'string' },
  'POST /api/auth/request-reset': { email: 'string' },
  'POST /api/auth/reset': { token: 'string', password: 'string' },
  'PATCH /api/me': { digestOptIn: 'boolean', notifyQuestions: 'boolean', notifyAnswers: 'boolean' },
  'POST /api/account/password': { currentPassword: 'string', newPassword: 'string' },
  'POST /api/seasons': { name: 'string', startsOn: 'string', endsOn: 'string', phase: 'string' },
  'PATCH /api/seasons/[id]': { name: 'string', phase: 'string', startsOn: 'string', current: 'boolean' },
  'POST /api/seasons/[id]/rollover': { continuing: 'array', confirm: 'boolean' },
  'POST /api/subsystems': { slug: 'string', name: 'string', summary: 'string' },
  'PATCH /api/subsystems/[slug]': { name: 'string', summary: 'string' },
  'PATCH /api/people/[id]': { role: 'string', subsystems: 'array' },
  'POST /api/people/[id]/nudge': { note: 'string' },
  'POST /api/invitations': { email: 'string', name: 'string', role: 'string', subsystems: 'array' },
  'POST /api/digest/send': { days: 'number' },
  'POST /api/records': {
    kind: 'string',
    title: 'string',
    subsystem: 'string',
    body: 'object',
    calculationIds: 'array',
  },
  'PATCH /api/records/[id]': { version: 'number', title: 'string', body: 'object', relatedRecordIds: 'array' },
  // Reads no body (its file's PATCH does); whatever is sent, an accepted record is never discarded.
  'DELETE /api/records/[id]': { version: 'number' },
  'POST /api/records/[id]/status': { status: 'string', supersededBy: 'string', version: 'number' },
  'POST /api/records/[id]/review': { note: 'string' },
  'POST /api/records/[id]/comments': { body: 'string', kind: 'string', replyTo: 'string', parentId: 'string' },
  'POST /api/records/[id]/attachments': { file: 'string' },
  'POST /api/imports': { file: 'string', subsystem: 'string', kind: 'string', seasonId: 'string' },
  'POST /api/calculators/[kind]/run': { inputs: 'object' },
  'POST /api/calculators/resistance/fit': { inputs: 'object', points: 'array', drivetrainEfficiency: 'number' },
  'POST /api/calculations': { kind: 'string', title: 'string', subsystem: 'string', inputs: 'object' },
  'POST /api/guides/[slug]/review': { note: 'string' },
  'POST /api/guides/[slug]/suggestions': { body: 'string', section: 'string' },
  'PATCH /api/guides/suggestions/[id]': { state: 'string' },
  'PATCH /api/calculations/[id]': { title: 'string', notes: 'string', subsystem: 'string' },
  // Shares its file with PATCH; reads no body, so whatever is sent must change nothing.
  'DELETE /api/calculations/[id]': { title: 'string' },
  'PUT /api/onboarding/[subsystem]': { items: 'array' },
  'PATCH /api/imports/[id]/records': { recordIds: 'array', kind: 'string', subsystem: 'string', seasonId: 'string' },
  'POST /api/imports/[id]/discard': { recordIds: 'array' },
  'POST /api/onboarding/[subsystem]/progress': { itemId: 'string', done: 'boolean' },
};

// mulberry32: a small seeded generator, so a failure can be replayed.
function rng(seed: number) {
  return () => {
    seed |= 0;
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const ODD = [
  '\u202e',
  '\u200b',
  '\u0000',
  '\ud800',
  '🚤⚡',
  'Ω≈ç√',
  '<script>alert(1)</script>',
  "'; DROP TABLE records; --",
  '${7*7}',
  '%00',
  '../../etc/passwd',
  '\r\n\r\n',
  'ǅ',
  'ﷺ',
];
const PROTO = ['__proto__', 'constructor', 'prototype'];

function makeValue(r: () => number, depth = 0): unknown {
  const k = Math.floor(r() * 9);
  if (depth > 3) return r() < 0.5 ? null : Math.floor(r() * 1e9);
  switch (k) {
    case 0:
      return null;
    case 1:
      return r() < 0.5 ? -1e308 * 10 : Math.floor(r() * 2 ** 53) * (r() < 0.5 ? -1 : 1);
    case 2:
      return ODD[Math.floor(r() * ODD.length)].repeat(1 + Math.floor(r() * 20));
    case 3:
      return 'x'.repeat(Math.floor(r() * 70_000));
    case 4:
      return [makeValue(r, depth + 1), makeValue(r, depth + 1)];
    case 5:
      return { [PROTO[Math.floor(r() * 3)]]: { polluted: true, isAdmin: true }, nested: makeValue(r, depth + 1) };
    case 6:
      return r() < 0.5;
    case 7:
      return { a: makeValue(r, depth + 1) };
    default:
      return '';
  }
}

function wrongFor(type: FieldType, r: () => number): unknown {
  const pool: Record<FieldType, unknown[]> = {
    string: [42, true, null, [], { $ne: null }, [ODD[0]], Infinity], // Infinity is sent as null in JSON
    number: ['1', 'NaN', null, true, [], { v: 1 }, '9'.repeat(400)],
    boolean: ['true', 1, 0, null, [], {}],
    array: ['a,b', 7, { 0: 'x' }, null, true],
    object: ['{}', 12, [], null, true],
  };
  const opts = pool[type];
  return opts[Math.floor(r() * opts.length)];
}

function deep(n: number): unknown {
  let v: unknown = 'bottom';
  for (let i = 0; i < n; i++) v = { d: v };
  return v;
}

/** One body: raw text (possibly not JSON) to send. */
function makeBody(fields: Record<string, FieldType>, r: () => number): string {
  const names = Object.keys(fields);
  const kind = Math.floor(r() * 8);
  switch (kind) {
    case 0:
      return ['{', '[', 'nul', '{"a":}', '\u0000\u0001', '"unterminated', '{"__proto__":', ")]}'"][Math.floor(r() * 8)];
    case 1:
      return JSON.stringify([1, 'two', { three: 3 }].slice(0, 1 + Math.floor(r() * 3)));
    case 2:
      return JSON.stringify([null, 0, -1, 'text', true][Math.floor(r() * 5)]);
    case 3:
      return JSON.stringify({ ...{ [names[0]]: wrongFor(fields[names[0]], r) }, ...(deep(2000) as object) });
    case 4: {
      // Prototype-pollution keys spelled into the JSON text itself.
      const name = names[Math.floor(r() * names.length)];
      return `{"__proto__":{"role":"lead","isAdmin":true},"constructor":{"prototype":{"polluted":1}},"${name}":${JSON.stringify(wrongFor(fields[name], r))}}`;
    }
    default: {
      const body: Record<string, unknown> = {};
      for (const n of names) if (r() < 0.6) body[n] = makeValue(r);
      const bad = names[Math.floor(r() * names.length)];
      body[bad] = wrongFor(fields[bad], r); // at least one of the route's own fields has a wrong type
      if (r() < 0.3) body['x'.repeat(1 + Math.floor(r() * 300))] = ODD[Math.floor(r() * ODD.length)];
      return JSON.stringify(body);
    }
  }
}

const TABLES = [
  'users',
  'sessions',
  'seasons',
  'subsystems',
  'season_memberships',
  'membership_subsystems',
  'invitations',
  'password_resets',
  'records',
  'record_revisions',
  'record_links',
  'record_calculations',
  'attachments',
  'comments',
  'calculations',
  'calculation_results',
  'onboarding_items',
  'onboarding_progress',
  'mail_messages',
  'imports',
  'import_items',
];

/** Everything stored except the audit log (which rightly records refused sign-ins). */
function fingerprint(): string {
  const c = db().$client;
  const parts = TABLES.map((t) => `${t}:${(c.prepare(`SELECT count(*) AS n FROM ${t}`).get() as { n: number }).n}`);
  const r = c
    .prepare(
      'SELECT total(version) AS v, max(updated_at) AS u, max(reviewed_at) AS rv, group_concat(status) AS s FROM records',
    )
    .get();
  const s = c.prepare('SELECT group_concat(name || phase || is_current) AS s FROM seasons').get();
  const u = c.prepare('SELECT group_concat(role || digest_opt_in) AS s FROM users').get();
  const sub = c.prepare('SELECT group_concat(name || summary) AS s FROM subsystems').get();
  const o = c.prepare('SELECT group_concat(position) AS s FROM onboarding_items').get();
  return JSON.stringify([parts, r, s, u, sub, o]);
}

const routes = Object.entries(modules).flatMap(([file, mod]) => {
  const source = sources[file];
  if (!/readJson\(|formData\(|uploadAttachment\(|startImport\(/.test(source)) return []; // routes that read no body have nothing to fuzz
  const path = file
    .replace('../../src/pages', '')
    .replace(/\.ts$/, '')
    .replace(/\/index$/, '');
  return (['POST', 'PUT', 'PATCH', 'DELETE'] as Method[])
    .filter((m) => typeof mod[m] === 'function')
    .map((m) => ({ key: `${m} ${path}`, method: m, mod }));
});

let s: Record<DemoRole, string>;
let params: Record<string, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  params = {
    id: '',
    slug: 'hull',
    subsystem: 'hull',
    kind: 'propeller',
  };
  params.season = listSeasons().find((x) => !x.current)!.id;
  params.person = listPeople().find((p) => p.role === 'alumni')!.id;
});

const BODIES = 200;

describe('fuzzing every write route that reads a body', () => {
  it('finds the body-reading write routes from the route files, and knows each one’s fields', () => {
    expect(routes.length).toBeGreaterThanOrEqual(15);
    expect(routes.map((r) => r.key).sort()).toEqual(Object.keys(FIELDS).sort());
  });

  for (const route of routes) {
    it(`${route.key}: ${BODIES} random bodies → only 4xx, no internals, nothing stored changes`, async () => {
      const r = rng([...route.key].reduce((a, ch) => a * 31 + ch.charCodeAt(0), 7) >>> 0);
      const fields = FIELDS[route.key];
      const id = route.key.includes('/records/')
        ? 'demo-rec-2526-two-propellers'
        : route.key.includes('/seasons/')
          ? params.season
          : params.person;
      const p = { id, slug: 'hull', subsystem: 'hull', kind: 'propeller' };
      const statuses = new Map<number, number>();
      for (let i = 0; i < BODIES; i++) {
        const raw = makeBody(fields, r);
        const before = fingerprint();
        const res = await call(route.mod, route.method, {
          session: s.lead,
          params: p,
          rawBody: raw,
          headers: { 'content-type': 'application/json' },
          ip: `127.9.${i % 250}.${Math.floor(r() * 250)}`,
        });
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        expect(res.status, `body #${i}: ${raw.slice(0, 200)} → ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
        expect(res.status, `body #${i}: ${raw.slice(0, 200)} → ${res.text.slice(0, 200)}`).toBeLessThan(500);
        expect(res.text).not.toMatch(/\bat .+\.(ts|js|mjs):\d+|node_modules|SqliteError|ZodError|TypeError|stack/i);
        expect(fingerprint(), `body #${i} changed stored data: ${raw.slice(0, 200)}`).toBe(before);
        expect(({} as Record<string, unknown>).polluted ?? ({} as Record<string, unknown>).isAdmin).toBeUndefined();
      }
      expect([...statuses.values()].reduce((a, b) => a + b)).toBe(BODIES);
    }, 120_000);
  }
});
