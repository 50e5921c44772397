import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await launch();
  page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
  await signIn(page, 'member@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

const output = (name: string) => page.locator(`[data-testid="outputs"] [data-output="${name}"]`);

/** Text on screen with a symbol still in underscore notation (K_T), outside code and the form's own field keys. */
const underscoreSymbols = (p: Page) =>
  p.locator('main').evaluate((main) => {
    const clone = main.cloneNode(true) as HTMLElement;
    for (const code of clone.querySelectorAll('code, script, style')) code.remove();
    return (clone.textContent ?? '').match(/(?<![A-Za-z0-9_])\p{L}_\S+/gu) ?? [];
  });

describe('calculators as a member uses them', () => {
  let savedUrl = '';

  it('opens the propeller calculator, changes an input and sees the result and the chart change', async () => {
    await page.goto(`${baseUrl()}/calculations`);
    await page.getByRole('link', { name: 'Propeller open-water performance' }).click();
    await page.waitForURL(/\/calculations\/new\/propeller$/);
    await output('thrust_N').waitFor();
    // Typing before the form's island has hydrated would be lost: Astro drops `ssr` from an island once hydrated.
    await page.waitForFunction(() => !document.querySelector('astro-island[ssr]'));
    const thrustBefore = await output('thrust_N').textContent();
    const chartLabelBefore = await page.locator('figure figcaption').first().textContent();
    await page.getByLabel('Pitch ratio P/D').fill('1.2');
    await expect.poll(() => output('thrust_N').textContent()).not.toBe(thrustBefore);
    await expect.poll(() => page.locator('figure figcaption').first().textContent()).not.toBe(chartLabelBefore);
    expect(await page.locator('canvas').count()).toBeGreaterThan(0);
    // Symbols read as symbols: K<sub>T</sub>, not K_T, in labels and tables.
    expect(await underscoreSymbols(page)).toEqual([]);
    expect(await page.getByRole('rowheader', { name: 'Thrust coefficient KT' }).locator('sub').textContent()).toBe('T');
    // Without hovering, the legend reads the operating point, not a dash.
    const legend = await page.locator('figure.chart .u-legend .u-value').allTextContents();
    expect(legend.length).toBeGreaterThan(1);
    for (const v of legend) expect(v).toMatch(/\d/);
    await shot(page, 'calculator-propeller');
  });

  it('shows the field message and a 422-style explanation outside the series range', async () => {
    await page.getByLabel('Pitch ratio P/D').fill('1.8');
    // Results follow typing through a deferred value: wait for the field to be marked, not for a fixed time.
    await expect.poll(() => page.getByLabel('Pitch ratio P/D').getAttribute('aria-invalid')).toBe('true');
    await page
      .getByRole('status')
      .filter({ hasText: /P\/D|pitch/i })
      .first()
      .waitFor();
    await page.getByLabel('Pitch ratio P/D').fill('1.1');
    await expect.poll(() => page.getByLabel('Pitch ratio P/D').getAttribute('aria-invalid')).toBeNull();
    await output('thrust_N').waitFor();
    await page.getByRole('button', { name: 'Save calculation' }).waitFor();
  });

  it('saves with a title, subsystem and notes, and reopens the saved calculation', async () => {
    await page.getByRole('button', { name: 'Save calculation' }).click();
    await page.getByText(/title of at least 3 characters/).waitFor();
    await page.getByLabel('Title').fill('E2E endurance propeller check');
    await page.getByLabel('Subsystem').selectOption('propulsion');
    await page.getByLabel(/^Notes/).fill('Saved by the browser test.');
    await Promise.all([
      page.waitForURL(/\/calculations\/[a-z2-7]{16}$/),
      page.getByRole('button', { name: 'Save calculation' }).click(),
    ]);
    savedUrl = page.url();
    await page.getByRole('heading', { level: 1, name: 'E2E endurance propeller check' }).waitFor();
    expect(await page.locator('[data-output="pitchRatio"]').count()).toBe(0);
    expect(await output('thrust_N').textContent()).toMatch(/\d/);
    await page.reload();
    await page.getByText('Saved by the browser test.').waitFor();
    expect(await underscoreSymbols(page)).toEqual([]);
    await shot(page, 'calculation-saved');
  });

  it('offers no recompute while the saved result comes from today’s engine', async () => {
    await page.goto(savedUrl);
    await page.getByRole('heading', { name: /^Outputs/ }).waitFor();
    expect(await page.getByRole('button', { name: /Recompute/ }).count()).toBe(0);
  });

  it('compares two saved calculations side by side with overlaid curves', async () => {
    await page.goto(`${baseUrl()}/calculations?kind=propeller`);
    await page.getByLabel('Compare Tern 5 endurance propeller at cruise').check();
    await page.getByLabel('Compare Tern 5 sprint propeller off the start').check();
    await Promise.all([
      page.waitForURL(/\/calculations\/compare/),
      page.getByRole('button', { name: 'Compare the two ticked' }).click(),
    ]);
    await page.getByRole('heading', { name: 'Compare calculations' }).waitFor();
    const pitchRow = page.getByRole('row', { name: /Pitch ratio/ });
    expect(await pitchRow.textContent()).toContain('differs');
    // A choice reads as its option's name, as on the saved page, not as its key.
    expect(await page.getByRole('row', { name: /^Water Fresh water Fresh water/ }).count()).toBe(1);
    await page.locator('figure').first().scrollIntoViewIfNeeded();
    await page.locator('canvas').first().waitFor();
    expect(await page.locator('figcaption').first().textContent()).toContain('(B, dashed)');
    expect(await underscoreSymbols(page)).toEqual([]);
    await shot(page, 'calculations-compare');
  });
});
