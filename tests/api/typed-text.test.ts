// NUL and lone UTF-16 surrogates in what people type (titles, names, comments) are refused with 400 on the field.
import { describe, it, expect, beforeAll } from 'vitest';
import type { APIRoute } from 'astro';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as calculationsRoute from '../../src/pages/api/calculations/index';
import * as invitationsRoute from '../../src/pages/api/invitations/index';
import * as seasonsRoute from '../../src/pages/api/seasons/index';
import * as subsystemsRoute from '../../src/pages/api/subsystems/index';
import { templateFor } from '../../src/lib/editor/templates';
import { typedLine, typedText } from '../../src/lib/schemas/text';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

type Route = Partial<Record<'POST', APIRoute>>;
const CASES: [string, Route, string, (text: string) => object, Record<string, string>?][] = [
  [
    'record title',
    recordsRoute,
    'title',
    (t) => ({ kind: 'decision', title: t, subsystem: 'battery', body: templateFor('decision') }),
  ],
  ['comment', commentsRoute, 'body', (t) => ({ body: t }), { id: 'demo-rec-2526-closed-cooling-loop' }],
  [
    'calculation title',
    calculationsRoute,
    'title',
    (t) => ({
      kind: 'cable',
      title: t,
      subsystem: 'battery',
      inputs: {},
    }),
  ],
  [
    'person name',
    invitationsRoute,
    'name',
    (t) => ({ email: 'new.person@northmere.example', name: t, role: 'member' }),
  ],
  [
    'season name',
    seasonsRoute,
    'name',
    (t) => ({ name: t, startsOn: '2030-01-01', endsOn: '2030-12-01', phase: 'design' }),
  ],
  ['subsystem name', subsystemsRoute, 'name', (t) => ({ slug: 'sails', name: t, summary: '' })],
];

describe.each(CASES)('%s', (_name, route, field, body, params) => {
  it.each([
    ['a NUL', 'Cable \u0000 sizing'],
    ['a lone high surrogate', 'Cable \ud800 sizing'],
    ['a lone low surrogate', 'Cable \udc00 sizing'],
  ])(`refuses %s with 400 on ${field}`, async (_what, text) => {
    const res = await call(route, 'POST', { session: s.lead, body: body(text), params });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
  });
});

describe('the shared helpers', () => {
  it('keep ordinary text, emoji (a surrogate pair) and, in several-line text, line breaks', () => {
    expect(typedLine().trim().parse('  Stern tube 🚤 – ø 40 mm ')).toBe('Stern tube 🚤 – ø 40 mm');
    expect(typedLine().trim().parse('Trailing line break\n')).toBe('Trailing line break');
    expect(typedLine().safeParse('Two\nlines').success).toBe(false);
    expect(typedText().parse('First line\n\tSecond line')).toBe('First line\n\tSecond line');
    expect(typedText().safeParse('NUL\u0000').success).toBe(false);
  });
});
