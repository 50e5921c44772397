// Authorization matrix for pages: every .astro page under src/pages × {signed out, alumni, advisor, member, lead},
// fetched from the built server. A page file without an entry here fails the test.
import { describe, it, expect, beforeAll } from 'vitest';
import { readdirSync } from 'node:fs';
import { baseUrl } from './browser';

type Who = 'out' | 'alumni' | 'advisor' | 'member' | 'lead';
const SIGNED_IN: Who[] = ['alumni', 'advisor', 'member', 'lead'];
const ok = (allowed: Who[]) =>
  Object.fromEntries(SIGNED_IN.map((w) => [w, allowed.includes(w) ? 200 : 403])) as Record<Exclude<Who, 'out'>, number>;
const everyone = ok(SIGNED_IN);

/** Expected status per page; signed-out visitors of private pages are redirected (302) to /sign-in. */
const PAGES: Record<string, { url: string; expect: Partial<Record<Who, number>> }> = {
  'index.astro': { url: '/', expect: { out: 302, ...everyone } },
  '404.astro': { url: '/no-such-page', expect: { out: 404, member: 404 } },
  '500.astro': { url: '/500', expect: { member: 500 } },
  'sign-in.astro': { url: '/sign-in', expect: { out: 200, member: 302 } },
  'sign-out.astro': { url: '/sign-out', expect: { out: 303 } },
  'forgot-password.astro': { url: '/forgot-password', expect: { out: 200 } },
  // The same for everyone (the service worker precaches it): it names no one and lists what the browser keeps.
  'offline.astro': { url: '/offline', expect: { out: 200, ...everyone } },
  'invite/[token].astro': { url: '/invite/not-a-real-invitation-token-xyz', expect: { out: 404 } },
  'reset/[token].astro': { url: '/reset/not-a-real-reset-token-xyz12', expect: { out: 404 } },
  'account.astro': { url: '/account', expect: { out: 302, ...everyone } },
  'subsystems/index.astro': { url: '/subsystems', expect: { out: 302, ...everyone } },
  'subsystems/[slug].astro': { url: '/subsystems/propulsion', expect: { out: 302, ...everyone } },
  'guides/index.astro': { url: '/guides', expect: { out: 302, ...everyone } },
  'guides/[slug].astro': { url: '/guides/reading-an-open-water-diagram', expect: { out: 302, ...everyone } },
  'guides/suggestions.astro': { url: '/guides/suggestions', expect: { out: 302, ...ok(['advisor', 'lead']) } },
  'records/index.astro': { url: '/records', expect: { out: 302, ...everyone } },
  'records/new.astro': { url: '/records/new?kind=lesson', expect: { out: 302, ...ok(['member', 'lead']) } },
  'records/[id]/index.astro': { url: '/records/demo-rec-2526-two-propellers', expect: { out: 302, ...everyone } },
  'records/[id]/edit.astro': {
    url: '/records/demo-rec-2526-two-propellers/edit',
    expect: { out: 302, ...ok(['member', 'lead']) },
  },
  'records/[id]/history.astro': {
    url: '/records/demo-rec-2526-two-propellers/history',
    expect: { out: 302, ...everyone },
  },
  'calculations/index.astro': { url: '/calculations', expect: { out: 302, ...everyone } },
  'calculations/new/[kind].astro': { url: '/calculations/new/cable', expect: { out: 302, ...everyone } },
  'calculations/[id].astro': {
    url: '/calculations/demo-calc-cable-battery-main-2526',
    expect: { out: 302, ...everyone },
  },
  'calculations/compare.astro': {
    url: '/calculations/compare?a=demo-calc-prop-endurance-2526&b=demo-calc-prop-sprint-2526',
    expect: { out: 302, ...everyone },
  },
  'people/index.astro': { url: '/people', expect: { out: 302, ...everyone } },
  'questions.astro': { url: '/questions', expect: { out: 302, ...everyone } },
  'pending.astro': { url: '/pending', expect: { out: 302, ...everyone } },
  'seasons/index.astro': { url: '/seasons', expect: { out: 302, ...everyone } },
  'handover.astro': { url: '/handover', expect: { out: 302, ...everyone } },
  'onboarding.astro': { url: '/onboarding', expect: { out: 302, ...ok(['lead']) } },
  'import/index.astro': { url: '/import', expect: { out: 302, ...ok(['member', 'lead']) } },
  // An unknown import: 404 for those who may import; 403 before anything is looked up for the rest.
  'import/[id].astro': {
    url: '/import/no-such-import',
    expect: { out: 302, alumni: 403, advisor: 403, member: 404, lead: 404 },
  },
  'search.astro': { url: '/search?q=propeller', expect: { out: 302, ...everyone } },
  'admin/index.astro': { url: '/admin', expect: { out: 302, ...ok(['lead']) } },
  'admin/people.astro': { url: '/admin/people', expect: { out: 302, ...ok(['lead']) } },
  'admin/invitations.astro': { url: '/admin/invitations', expect: { out: 302, ...ok(['lead']) } },
  'admin/outbox.astro': { url: '/admin/outbox', expect: { out: 302, ...ok(['lead']) } },
  'admin/audit.astro': { url: '/admin/audit', expect: { out: 302, ...ok(['lead']) } },
  'admin/export.astro': { url: '/admin/export', expect: { out: 302, ...ok(['lead']) } },
  'admin/digest.astro': { url: '/admin/digest', expect: { out: 302, ...ok(['lead']) } },
};

function pageFiles(dir = 'src/pages', prefix = ''): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    if (e.isDirectory()) return e.name === 'api' && !prefix ? [] : pageFiles(`${dir}/${e.name}`, `${prefix}${e.name}/`);
    return e.name.endsWith('.astro') ? [`${prefix}${e.name}`] : [];
  });
}

const cookies: Partial<Record<Who, string>> = {};
beforeAll(async () => {
  for (const who of SIGNED_IN) {
    const res = await fetch(`${baseUrl()}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: `${who}@wakebook.test`, password: 'wakebook-demo' }),
    });
    cookies[who] = res.headers
      .getSetCookie()
      .find((c) => c.startsWith('wakebook_session='))!
      .split(';')[0];
  }
});

describe('page authorization matrix', () => {
  it('has an entry for every page file', () => {
    expect(pageFiles().sort()).toEqual(Object.keys(PAGES).sort());
  });

  for (const [file, page] of Object.entries(PAGES)) {
    it(`${file} (${page.url})`, async () => {
      for (const [who, status] of Object.entries(page.expect) as [Who, number][]) {
        const res = await fetch(`${baseUrl()}${page.url}`, {
          redirect: 'manual',
          headers: who === 'out' ? {} : { cookie: cookies[who]! },
        });
        expect(res.status, `${who} on ${page.url}`).toBe(status);
        if (status === 302 && who === 'out') expect(res.headers.get('location')).toMatch(/^\/sign-in/);
        const body = await res.text();
        expect(body).not.toMatch(/\bat .+\.(ts|js|mjs):\d+/);
        // Every response carries the security headers.
        expect(res.headers.get('x-content-type-options')).toBe('nosniff');
        expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
        expect(res.headers.get('referrer-policy')).toBeTruthy();
      }
    });
  }
});
