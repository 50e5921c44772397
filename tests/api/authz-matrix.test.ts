// Authorization matrix: every API route file × {signed out, alumni, advisor, member, lead}. The list of routes is
// read from src/pages/api, so a new route without an entry here fails this test.
import { describe, it, expect, beforeAll } from 'vitest';
import type { APIRoute } from 'astro';
import { call } from '../setup/http';
import { seedDemo, sessionFor, sessionsForAllRoles, type DemoRole } from '../setup/db';
import { listSeasons } from '../../src/lib/server/seasons';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const modules = import.meta.glob<Partial<Record<Method, APIRoute>>>('../../src/pages/api/**/*.ts', { eager: true });
const ROLES: DemoRole[] = ['alumni', 'advisor', 'member', 'lead'];
const ALL = ROLES;
const LEAD: DemoRole[] = ['lead'];
const WRITERS: DemoRole[] = ['member', 'lead'];
const REVIEWERS: DemoRole[] = ['advisor', 'lead'];

interface Row {
  /** 'public': no session needed; otherwise the roles allowed (the rest get 403, the signed-out 401). */
  allow: DemoRole[] | 'public';
  params?: Record<string, string>;
  /** Sends a fresh session (the route ends the session it is given). */
  fresh?: boolean;
}

const REC = { id: 'demo-rec-2526-two-propellers' };
const CALC = { id: 'demo-calc-prop-endurance-2526' };
const MATRIX: Record<string, Row> = {
  'GET /api/health': { allow: 'public' },
  'POST /api/auth/sign-in': { allow: 'public' },
  'POST /api/auth/sign-out': { allow: 'public', fresh: true },
  'POST /api/auth/accept-invitation': { allow: 'public' },
  'POST /api/auth/request-reset': { allow: 'public' },
  'POST /api/auth/reset': { allow: 'public' },
  'GET /api/me': { allow: ALL },
  'PATCH /api/me': { allow: ALL },
  'POST /api/account/password': { allow: ALL },
  'GET /api/seasons': { allow: ALL },
  'POST /api/seasons': { allow: LEAD },
  'PATCH /api/seasons/[id]': { allow: LEAD, params: { id: 'SEASON' } },
  'POST /api/seasons/[id]/rollover': { allow: LEAD, params: { id: 'SEASON' } },
  'GET /api/subsystems': { allow: ALL },
  'POST /api/subsystems': { allow: LEAD },
  'PATCH /api/subsystems/[slug]': { allow: LEAD, params: { slug: 'hull' } },
  'GET /api/people': { allow: ALL },
  'PATCH /api/people/[id]': { allow: LEAD, params: { id: 'nope' } },
  'POST /api/people/[id]/nudge': { allow: LEAD, params: { id: 'nope' } },
  'GET /api/invitations': { allow: LEAD },
  'POST /api/invitations': { allow: LEAD },
  'DELETE /api/invitations/[id]': { allow: LEAD, params: { id: 'nope' } },
  'POST /api/invitations/[id]/resend': { allow: LEAD, params: { id: 'nope' } },
  'POST /api/invitations/[id]/revoke': { allow: LEAD, params: { id: 'nope' } },
  'GET /api/outbox': { allow: LEAD },
  'GET /api/audit': { allow: LEAD },
  'GET /api/export': { allow: LEAD },
  'GET /api/backup': { allow: LEAD },
  'POST /api/digest/send': { allow: LEAD },
  'GET /api/records': { allow: ALL },
  'POST /api/records': { allow: WRITERS },
  'GET /api/records/[id]': { allow: ALL, params: REC },
  'PATCH /api/records/[id]': { allow: WRITERS, params: REC },
  // Drafts only, by their author or a lead: the demo record is accepted, so writers get 409 here, others 403.
  'DELETE /api/records/[id]': { allow: WRITERS, params: REC },
  'GET /api/records/[id]/revisions': { allow: ALL, params: REC },
  'POST /api/records/[id]/status': { allow: [...WRITERS, 'advisor'], params: REC },
  'POST /api/records/[id]/review': { allow: REVIEWERS, params: { id: 'nope' } },
  'GET /api/records/[id]/comments': { allow: ALL, params: REC },
  'POST /api/records/[id]/comments': { allow: ALL, params: { id: 'nope' } },
  'POST /api/records/[id]/attachments': { allow: WRITERS, params: REC },
  // Who may mark a question answered depends on the question (asker, record author): tests/api/questions.test.ts.
  'POST /api/comments/[id]/answered': { allow: ALL, params: { id: 'nope' } },
  'GET /api/questions': { allow: ALL },
  'GET /api/attachments/[id]': { allow: ALL, params: { id: 'nope' } },
  'GET /api/calculators': { allow: ALL },
  'POST /api/calculators/[kind]/run': { allow: ALL, params: { kind: 'cable' } },
  'POST /api/calculators/resistance/fit': { allow: ALL },
  'GET /api/calculations': { allow: ALL },
  'POST /api/calculations': { allow: WRITERS },
  'GET /api/calculations/[id]': { allow: ALL, params: CALC },
  'PATCH /api/calculations/[id]': { allow: WRITERS, params: { id: 'nope' } },
  'DELETE /api/calculations/[id]': { allow: WRITERS, params: { id: 'nope' } },
  'POST /api/calculations/[id]/recompute': { allow: WRITERS, params: { id: 'nope' } },
  'GET /api/calculations/compare': { allow: ALL },
  'GET /api/guides': { allow: ALL },
  'POST /api/guides/[slug]/review': { allow: REVIEWERS, params: { slug: 'nope' } },
  'GET /api/guides/[slug]/suggestions': { allow: REVIEWERS, params: { slug: 'handover-checklist' } },
  'POST /api/guides/[slug]/suggestions': { allow: ALL, params: { slug: 'nope' } },
  'PATCH /api/guides/suggestions/[id]': { allow: REVIEWERS, params: { id: 'nope' } },
  'GET /api/onboarding/[subsystem]': { allow: ALL, params: { subsystem: 'hull' } },
  'PUT /api/onboarding/[subsystem]': { allow: REVIEWERS, params: { subsystem: 'nope' } },
  'POST /api/onboarding/[subsystem]/progress': { allow: ALL, params: { subsystem: 'hull' } },
  // The importer's or a lead's; an unknown import is 404 for writers, 403 for the rest (tests/api/import-review.test.ts).
  'GET /api/imports/[id]/records': { allow: WRITERS, params: { id: 'nope' } },
  'PATCH /api/imports/[id]/records': { allow: WRITERS, params: { id: 'nope' } },
  'POST /api/imports/[id]/discard': { allow: WRITERS, params: { id: 'nope' } },
  'GET /api/readiness': { allow: ALL },
  'GET /api/imports': { allow: WRITERS },
  'POST /api/imports': { allow: WRITERS },
  // Any signed-in person reaches the lookup; only the importer or a lead sees an import (tests/api/imports.test.ts).
  'GET /api/imports/[id]': { allow: ALL, params: { id: 'nope' } },
  'GET /api/offline/pack': { allow: ALL },
  'GET /api/search': { allow: ALL },
};

const routes = Object.entries(modules).flatMap(([file, mod]) => {
  const path = file
    .replace('../../src/pages', '')
    .replace(/\.ts$/, '')
    .replace(/\/index$/, '');
  return (['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as Method[])
    .filter((m) => typeof mod[m] === 'function')
    .map((m) => ({ key: `${m} ${path}`, method: m, mod }));
});

let s: Record<DemoRole, string>;
let seasonId = '';
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  seasonId = listSeasons().find((x) => !x.current)!.id;
});

describe('authorization matrix', () => {
  it('has exactly one entry for every route and method in src/pages/api', () => {
    expect(routes.map((r) => r.key).sort()).toEqual(Object.keys(MATRIX).sort());
  });

  for (const r of routes) {
    const row = MATRIX[r.key];
    if (!row) continue;
    it(`${r.key}: signed out ${row.allow === 'public' ? 'allowed' : '401'}, ${row.allow === 'public' ? 'everyone allowed' : `allowed: ${row.allow.join(', ')}`}`, async () => {
      const params = Object.fromEntries(
        Object.entries(row.params ?? {}).map(([k, v]) => [k, v === 'SEASON' ? seasonId : v]),
      );
      const send = (session?: string) =>
        call(r.mod, r.method, {
          params,
          session,
          body: r.method === 'GET' ? undefined : {},
          path: r.key.split(' ')[1],
        });
      const out = await send();
      if (row.allow === 'public') expect(out.status, 'signed out').not.toBe(401);
      else expect(out.status, 'signed out').toBe(401);
      for (const role of ROLES) {
        const session = row.fresh ? await sessionFor(role) : s[role];
        const res = await send(session);
        const allowed = row.allow === 'public' || row.allow.includes(role);
        if (allowed)
          expect([401, 403], `${role} should be allowed, got ${res.status} ${res.text.slice(0, 120)}`).not.toContain(
            res.status,
          );
        else expect(res.status, `${role} should be refused`).toBe(403);
        expect(res.status, `${role}: ${res.text.slice(0, 200)}`).toBeLessThan(500);
      }
    });
  }
});
