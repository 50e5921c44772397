// Unknown records, calculations, subsystems and guides answer 404 with our own page (never an empty body), and the
// reason phrase matches the status. The account menu closes on Escape.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await launch();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await signIn(page, 'member@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

describe('not found', () => {
  for (const path of [
    '/records/no-such-record',
    '/records/no-such-record/history',
    '/records/no-such-record/edit',
    '/calculations/no-such-calculation',
    '/calculations/new/no-such-kind',
    '/subsystems/no-such-subsystem',
    '/guides/no-such-guide',
    '/handover?season=no-such-season',
  ])
    it(`${path}: 404 "Not Found" with our page`, async () => {
      const res = await page.goto(`${baseUrl()}${path}`);
      expect(res?.status()).toBe(404);
      expect(res?.statusText()).toBe('Not Found');
      expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('This page is not in the log');
      expect(await page.getByRole('link', { name: 'Go home' }).count()).toBe(1);
      if (path === '/records/no-such-record') await shot(page, 'not-found-record');
    });

  it('a forbidden page says "Forbidden" in its status line', async () => {
    const res = await page.goto(`${baseUrl()}/admin/audit`);
    expect(res?.status()).toBe(403);
    expect(res?.statusText()).toBe('Forbidden');
  });
});

describe('readiness bars', () => {
  it('share one track length on the handover report and the subsystem list, so scores compare', async () => {
    for (const path of ['/handover', '/subsystems']) {
      await page.goto(`${baseUrl()}${path}`);
      const widths = await page
        .locator('main [data-readiness-track]')
        .evaluateAll((els) => els.map((e) => Math.round(e.getBoundingClientRect().width)));
      expect(widths.length, path).toBeGreaterThan(5);
      expect(new Set(widths).size, `${path}: ${widths.join(', ')}`).toBe(1);
    }
  });
});

describe('seasons admin', () => {
  it('offers no "Make current" on earlier seasons and opens the next season inside the rollover', async () => {
    const lead = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    await signIn(lead, 'lead@wakebook.test');
    await lead.goto(`${baseUrl()}/seasons`);
    await lead.locator('[data-island][data-mounted] button').first().waitFor({ state: 'attached' });
    // 2023–24 and 2024–25 are earlier than 2025–26; another test may have opened 2026–27 (which may be made current).
    expect(await lead.getByText('Earlier than the current season').count()).toBe(2);
    const later = await lead.getByRole('heading', { name: '2026–27', level: 2 }).count();
    expect(await lead.getByRole('button', { name: 'Make current' }).count()).toBe(later);
    await lead.getByRole('button', { name: 'Start the rollover…' }).click();
    if (later === 0) {
      // No season after 2025–26 (ends 2026-12-18): the wizard offers to open it, dated to follow on.
      await lead.getByRole('heading', { name: 'Open the next season' }).waitFor();
      expect(await lead.locator('#next-season-startsOn').inputValue()).toBe('2026-12-19');
      expect(await lead.locator('#next-season-endsOn').inputValue()).toBe('2027-12-18');
      expect(await lead.locator('#next-season-name').inputValue()).toBe('2026–27');
    } else {
      const options = await lead.locator('#roll-target option').allTextContents();
      expect(options.every((o) => o.startsWith('2026–27'))).toBe(true);
    }
    await shot(lead, 'seasons-rollover-open-next');
    await lead.context().close();
  });
});

describe('account menu', () => {
  it('closes on Escape and gives focus back to its button', async () => {
    await page.goto(`${baseUrl()}/`);
    const summary = page.getByLabel(/^Account menu for /);
    await summary.click();
    const menu = page.locator('details[data-account-menu]');
    expect(await menu.getAttribute('open')).not.toBeNull();
    await page.keyboard.press('Escape');
    await page.waitForFunction(() => !document.querySelector('details[data-account-menu]')?.hasAttribute('open'));
    expect(await page.evaluate(() => document.activeElement?.tagName)).toBe('SUMMARY');
  });
});
