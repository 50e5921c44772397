// Reading offline (issue 16): after one online visit, a member reads a guide, a record of their subsystem and a
// saved calculation, and runs a calculator, with the network off; a page that is not kept gets the offline page;
// the next person to sign in on the same browser finds none of the first person's kept pages.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, baseUrl, signIn, shot } from './browser';

const GUIDE = '/guides/endurance-versus-sprint-propeller';
const RECORD = '/records/demo-rec-2526-closed-cooling-loop'; // cooling: the demo member's, not the demo alumnus's
const CALCULATION = '/calculations/demo-calc-prop-endurance-2526';
const CALCULATOR = '/calculations/new/propeller';
const NOT_KEPT = '/people';

let browser: Browser;
let context: BrowserContext;
let page: Page;
beforeAll(async () => {
  browser = await launch();
  context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  page = await context.newPage();
});
afterAll(async () => {
  await browser?.close();
});

/** Waits until the worker controls the page and has stored the signed-in person's pack (the pages are then warm). */
async function waitForWarmPack(p: Page): Promise<string> {
  await p.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  const person = await p.evaluate(() => document.documentElement.dataset.person ?? '');
  expect(person).not.toBe('');
  const hasPack = () =>
    p.evaluate(async (who) => {
      if (!(await caches.has(`wakebook-meta-${who}`))) return false;
      return !!(await (await caches.open(`wakebook-meta-${who}`)).match('/__wakebook/pack'));
    }, person);
  await expect.poll(hasPack, { timeout: 45_000, interval: 300 }).toBe(true);
  return person;
}

async function cacheNames(p: Page): Promise<string[]> {
  return p.evaluate(() => caches.keys());
}

async function keptUrls(p: Page): Promise<string[]> {
  return p.evaluate(async () => {
    const out: string[] = [];
    for (const name of await caches.keys()) {
      if (!name.startsWith('wakebook-')) continue;
      for (const r of await (await caches.open(name)).keys()) out.push(new URL(r.url).pathname);
    }
    return out;
  });
}

const h1 = (p: Page) => p.getByRole('heading', { level: 1 }).first().textContent();
const output = (p: Page, name: string) => p.locator(`[data-output="${name}"]`);

async function thrustAtPitch(p: Page, pitch: string): Promise<string> {
  await p.goto(`${baseUrl()}${CALCULATOR}`);
  await output(p, 'thrust_N').waitFor();
  await p.waitForFunction(() => !document.querySelector('astro-island[ssr]'));
  const before = await output(p, 'thrust_N').textContent();
  await p.getByLabel('Pitch ratio P/D').fill(pitch);
  await expect.poll(() => output(p, 'thrust_N').textContent()).not.toBe(before);
  return (await output(p, 'thrust_N').textContent()) ?? '';
}

describe('reading offline', () => {
  let member = '';
  let onlineThrust = '';

  it('keeps what a member needs after one online visit', async () => {
    await signIn(page, 'member@wakebook.test');
    member = await waitForWarmPack(page);
    const kept = await keptUrls(page);
    for (const url of [GUIDE, RECORD, CALCULATION, CALCULATOR]) expect(kept).toContain(url);
    expect(kept).not.toContain(NOT_KEPT);
    expect(await cacheNames(page)).toEqual(
      expect.arrayContaining([`wakebook-pages-${member}`, `wakebook-meta-${member}`]),
    );
    onlineThrust = await thrustAtPitch(page, '1.2');
  });

  it('with the network off, a guide, a record, a saved calculation and a calculator all work', async () => {
    await context.setOffline(true);

    await page.goto(`${baseUrl()}${GUIDE}`);
    expect(await h1(page)).toContain('endurance versus sprint');
    const notice = page.locator('#offline-status .offline-age');
    await notice.waitFor();
    expect(await notice.textContent()).toMatch(/^You are offline — this page was kept .+\.$/);

    await page.goto(`${baseUrl()}${RECORD}`);
    expect(await h1(page)).toContain('Close the cooling loop');

    await page.goto(`${baseUrl()}${CALCULATION}`);
    expect(await h1(page)).toBe('Tern 5 endurance propeller at cruise');
    expect(await page.locator('[data-output]').count()).toBeGreaterThan(0);

    // The same result as online, with the chart and the cautions.
    expect(await thrustAtPitch(page, '1.2')).toBe(onlineThrust);
    expect(await page.locator('canvas').count()).toBeGreaterThan(0);
    expect(await page.getByText('A spinning propeller cuts and entangles').count()).toBeGreaterThan(0);
    await shot(page, 'offline-calculator');
  });

  it('answers a page that is not kept with the offline page, listing what is kept', async () => {
    await page.goto(`${baseUrl()}${NOT_KEPT}`);
    expect(await h1(page)).toBe('This page is not kept on this device');
    const list = page.locator('#kept-pages');
    await list.getByRole('heading', { name: /^Guides/ }).waitFor();
    expect(await list.getByRole('link', { name: /Close the cooling loop/ }).count()).toBe(1);
    expect(await list.getByRole('heading', { name: /^Calculators/ }).count()).toBe(1);
    await shot(page, 'offline-page');
    await page.setViewportSize({ width: 390, height: 844 });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, 'offline-page-phone');
    await page.emulateMedia({ colorScheme: 'dark' });
    await shot(page, 'offline-page-dark');
    await page.emulateMedia({ colorScheme: 'light' });
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it('shows the next person on this browser none of the first person’s kept pages', async () => {
    await context.setOffline(false);
    await page.goto(`${baseUrl()}/`);
    await page.locator('summary[aria-label^="Account menu"]').click();
    await Promise.all([page.waitForURL(/\/sign-in/), page.getByRole('button', { name: 'Sign out' }).click()]);
    await expect.poll(() => cacheNames(page)).not.toContain(`wakebook-pages-${member}`);
    expect((await cacheNames(page)).filter((n) => n.startsWith('wakebook-'))).toEqual([]);

    await signIn(page, 'alumni@wakebook.test');
    const alumni = await waitForWarmPack(page);
    expect(alumni).not.toBe(member);
    expect((await cacheNames(page)).filter((n) => n.includes(member))).toEqual([]);
    expect(await keptUrls(page)).not.toContain(RECORD);

    await context.setOffline(true);
    await page.goto(`${baseUrl()}${RECORD}`);
    expect(await h1(page)).toBe('This page is not kept on this device');
    await page.locator('#kept-pages h2').first().waitFor();
    expect(
      await page
        .locator('#kept-pages')
        .getByRole('link', { name: /Close the cooling loop/ })
        .count(),
    ).toBe(0);
    await context.setOffline(false);
  });
});
