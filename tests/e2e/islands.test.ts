// Islands are mounted by one bundled module script (src/scripts/islands.ts) over plain HTML written by
// src/components/Island.astro: no page carries an inline script, the policy allows only our own script files, and
// every island on the page still mounts (hydrating the server's HTML where there is some) without an error.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, baseUrl, signIn } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

// Pages with islands of every kind: rendered on the server and hydrated (comments, route checklist, account
// forms), browser-only with a stand-in (header search, status, review, uploader, CSV plots), and when visible.
const PAGES = [
  { path: '/records/demo-rec-2526-two-propellers', as: 'lead@wakebook.test' },
  { path: '/subsystems/battery', as: 'lead@wakebook.test' },
  { path: '/account', as: 'member@wakebook.test' },
  { path: '/calculations/new/propeller', as: 'member@wakebook.test' },
];

describe('islands from one script', () => {
  for (const { path, as } of PAGES) {
    it(`${path}: no inline script, script-src 'self', every reachable island mounts without errors`, async () => {
      const ctx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await ctx.newPage();
      const problems: string[] = [];
      page.on('console', (m) => {
        // A hydration mismatch, a policy violation or a failed mount all show as console errors.
        if (m.type() === 'error') problems.push(m.text());
      });
      page.on('pageerror', (e) => problems.push(e.message));
      await signIn(page, as);
      const res = await page.goto(`${baseUrl()}${path}`);
      expect(res?.headers()['content-security-policy']).toMatch(/; script-src 'self'$/);
      const html = (await res?.text()) ?? '';
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag).toMatch(/\bsrc="\/_astro\/[^"]+\.js"/);
      expect(html).not.toContain('<astro-island');

      // Bring every island into view once (the `visible` ones wait for that); one inside a closed <details>
      // stays asleep until opened, as it should.
      const islands = page.locator('[data-island]');
      const count = await islands.count();
      expect(count).toBeGreaterThan(1);
      for (let i = 0; i < count; i++) await islands.nth(i).evaluate((el) => el.firstElementChild?.scrollIntoView());
      await page.waitForFunction(
        () =>
          [...document.querySelectorAll('[data-island]')].every(
            (el) => el.hasAttribute('data-mounted') || el.closest('details:not([open])') !== null,
          ),
        null,
        { timeout: 15_000 },
      );
      const mounted = await page.locator('[data-island][data-mounted]').count();
      expect(mounted).toBeGreaterThan(1);
      expect(problems).toEqual([]);
      await ctx.close();
    });
  }

  it('a server-rendered island is in the HTML before any script runs, then hydrates (the account page’s digest switch)', async () => {
    const ctx = await browser.newContext();
    const page = await ctx.newPage();
    await signIn(page, 'member@wakebook.test');
    const res = await page.goto(`${baseUrl()}/account`);
    const html = (await res?.text()) ?? '';
    // Rendered on the server: the form is in the HTML before any script runs.
    expect(html).toMatch(/data-island="account\/DigestToggle"[^>]*data-ssr[^>]*>\s*<[a-z]/);
    await page.locator('[data-island="account/DigestToggle"][data-mounted]').waitFor({ state: 'attached' });
    await ctx.close();
  });
});
