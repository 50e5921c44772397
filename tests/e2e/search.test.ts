import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Waits until the header's search island is mounted (src/scripts/islands.ts marks it `data-mounted`). */
async function headerReady(page: Page): Promise<void> {
  await page.waitForFunction(() => {
    const island = document.querySelector('[data-island="search/HeaderSearch"]');
    return island !== null && island.hasAttribute('data-mounted');
  });
}

async function memberPage(javaScriptEnabled = true): Promise<Page> {
  const ctx = await browser.newContext({ viewport: { width: 1280, height: 900 }, javaScriptEnabled });
  const page = await ctx.newPage();
  await signIn(page, 'member@wakebook.test');
  return page;
}

describe('search in the header', () => {
  it('"/" focuses the field; results appear as you type; arrows move, Enter opens, Escape closes', async () => {
    const page = await memberPage();
    await page.goto(`${baseUrl()}/records`);
    const box = page.getByRole('combobox', { name: 'Search everything' });
    await box.waitFor();
    await headerReady(page);
    await page.locator('body').press('/');
    expect(await box.evaluate((el) => el === document.activeElement)).toBe(true);

    await page.keyboard.type('propel');
    const list = page.getByRole('listbox', { name: 'Search results' });
    const options = list.getByRole('option');
    await expect.poll(() => options.count(), { timeout: 10_000 }).toBeGreaterThan(1);
    expect(await box.getAttribute('aria-expanded')).toBe('true');
    expect(await list.locator('mark').count()).toBeGreaterThan(0);
    await shot(page, 'search-header-dropdown');

    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    const second = options.nth(1);
    expect(await second.getAttribute('aria-selected')).toBe('true');
    expect(await box.getAttribute('aria-activedescendant')).toBe(await second.getAttribute('id'));
    const href = (await second.getAttribute('href'))!;
    const title = (await second.locator('span').first().textContent())!;

    await page.keyboard.press('ArrowUp');
    expect(await options.first().getAttribute('aria-selected')).toBe('true');
    await page.keyboard.press('ArrowDown');

    await Promise.all([page.waitForURL((u) => u.pathname === href), page.keyboard.press('Enter')]);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect((await page.getByRole('heading', { level: 1 }).textContent())?.trim()).toBe(title.trim());

    // Escape closes the list; typing again opens it.
    const box2 = page.getByRole('combobox', { name: 'Search everything' });
    await headerReady(page);
    await box2.click();
    await page.keyboard.type('ventilation');
    await expect
      .poll(() => page.getByRole('listbox', { name: 'Search results' }).getByRole('option').count(), {
        timeout: 10_000,
      })
      .toBeGreaterThan(1);
    await page.keyboard.press('Escape');
    expect(await box2.getAttribute('aria-expanded')).toBe('false');
    expect(await page.getByRole('listbox', { name: 'Search results' }).isVisible()).toBe(false);
    await page.context().close();
  });

  it('filter chips narrow the dropdown; a typo is corrected; Enter without a choice opens the results page', async () => {
    const page = await memberPage();
    await page.goto(`${baseUrl()}/`);
    await headerReady(page);
    const box = page.getByRole('combobox', { name: 'Search everything' });
    await box.click();
    await page.keyboard.type('propeler');
    const options = page.getByRole('listbox', { name: 'Search results' }).getByRole('option');
    await expect.poll(() => options.count(), { timeout: 10_000 }).toBeGreaterThan(1);
    await page.getByText(/Showing results for “propeller”/).waitFor();
    await page.getByRole('group', { name: 'Show only' }).getByRole('button', { name: 'Guides' }).click();
    await expect
      .poll(
        async () => {
          const hrefs = await options.evaluateAll((els) => els.map((e) => e.getAttribute('href') ?? ''));
          return hrefs.length > 1 && hrefs.slice(0, -1).every((h) => h.startsWith('/guides/'));
        },
        { timeout: 10_000 },
      )
      .toBe(true);
    await box.focus();
    await Promise.all([page.waitForURL(/\/search\?/), page.keyboard.press('Enter')]);
    const url = new URL(page.url());
    expect(url.searchParams.get('q')).toBe('propeler');
    expect(url.searchParams.get('type')).toBe('guide');
    await page.getByRole('heading', { level: 2, name: /results? for “propeler”/ }).waitFor();
    await page.context().close();
  });
});

describe('the results page without JavaScript', () => {
  it('searches with the header form, shows marked snippets, filters by chip and opens a result', async () => {
    const page = await memberPage(false);
    await page.goto(`${baseUrl()}/`);
    // Without JavaScript the header holds a plain search field (no list of suggestions, so no combobox).
    const box = page.getByRole('searchbox', { name: 'Search everything' });
    await box.fill('ventilation');
    await Promise.all([page.waitForURL(/\/search\?q=ventilation/), box.press('Enter')]);
    await page.getByRole('heading', { level: 1, name: 'Search' }).waitFor();
    const results = page.locator('main ol > li');
    expect(await results.count()).toBeGreaterThan(1);
    expect(await page.locator('main ol mark').count()).toBeGreaterThan(0);
    await shot(page, 'search-results-no-js');

    await page.getByRole('navigation', { name: 'Show only' }).getByRole('link', { name: 'Lessons' }).click();
    await page.waitForURL(/type=lesson/);
    const kinds = await page.locator('main ol > li article > p > span:first-child').allTextContents();
    expect(kinds.length).toBeGreaterThan(0);
    expect(kinds.every((k) => k === 'Lesson')).toBe(true);

    const first = page.locator('main ol > li h3 a').first();
    const href = (await first.getAttribute('href'))!;
    await Promise.all([page.waitForURL((u) => u.pathname === href), first.click()]);
    await page.context().close();
  });

  it('shows the filters form, an empty state and a message for a search that is too long', async () => {
    const page = await memberPage(false);
    await page.goto(`${baseUrl()}/search`);
    await page.getByText('What are you looking for?').waitFor();
    await page.getByLabel('Words to find').fill('cell');
    await page.getByLabel('Subsystem').selectOption('battery');
    await Promise.all([
      page.waitForURL(/subsystem=battery/),
      page.getByRole('button', { name: 'Search', exact: true }).click(),
    ]);
    expect(await page.locator('main ol > li').count()).toBeGreaterThan(0);
    await page.goto(`${baseUrl()}/search?q=${'x'.repeat(600)}`);
    await page.getByText(/Keep a search under 500 characters/).waitFor();
    await page.context().close();
  });
});
