// Importing documents in the browser: choose files, watch the conversion, and review the drafts (bulk kind change,
// discard, open in the editor); the page at phone width; an axe check of the review list.
import { describe, it, expect, beforeAll, afterAll, inject } from 'vitest';
import Database from 'better-sqlite3';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

const require = createRequire(import.meta.url);
const AXE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');
const SAMPLE = 'content/demo/import-sample';

let browser: Browser;
let ctx: BrowserContext;
let page: Page;
let importUrl = '';

beforeAll(async () => {
  browser = await launch();
  ctx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  page = await ctx.newPage();
  await signIn(page, 'member@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

const sample = (name: string, mimeType: string) => ({ name, mimeType, buffer: readFileSync(`${SAMPLE}/${name}`) });
const noSidewaysScroll = (p: Page) => p.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);
const imported = (p: Page) => p.getByRole('list', { name: 'Imported files' }).getByRole('listitem');

describe('importing documents', () => {
  it('starts from the records list, says its limits, and lists no imports yet', async () => {
    await page.goto(`${baseUrl()}/records`);
    await Promise.all([page.waitForURL(/\/import$/), page.getByRole('link', { name: 'Import documents' }).click()]);
    await page.getByRole('heading', { level: 1, name: 'Import documents' }).waitFor();
    expect(await page.getByText(/Each document up to \d+ MB; a zip up to \d+ MB\./).count()).toBe(1);
    await page.getByText('No imports yet').waitFor();
    await shot(page, 'import-empty');
  });

  it('refuses to start without files and a subsystem, saying so beside the fields', async () => {
    // A member's own subsystem comes chosen; clear it to see the field's message.
    await page.getByLabel('Subsystem').selectOption('');
    await page.getByRole('button', { name: 'Start import' }).click();
    await page.getByText('Choose at least one file.').waitFor();
    await page.getByText('Choose a subsystem.').waitFor();
    expect(page.url()).toMatch(/\/import$/);
  });

  it('imports the sample Markdown, text and HTML files and follows the conversion to the end', async () => {
    await page
      .getByLabel('Documents to import')
      .setInputFiles([
        sample('launch-day-checklist.md', 'text/markdown'),
        sample('charger-notes.txt', 'text/plain'),
        sample('pod-seal-leak.html', 'text/html'),
      ]);
    await page.getByRole('heading', { name: /^3 files chosen/ }).waitFor();
    await page.getByLabel('Subsystem').selectOption('battery');
    await page.getByLabel('decision record').check();
    await Promise.all([
      page.waitForURL(/\/import\/[A-Za-z0-9_-]+$/),
      page.getByRole('button', { name: 'Start import' }).click(),
    ]);
    importUrl = page.url();
    await page.getByText('3 of 3 files done').waitFor({ timeout: 30_000 });
    await page.getByRole('heading', { name: 'Conversion finished' }).waitFor();
    await expect.poll(() => imported(page).count()).toBe(3);
    const rows = await imported(page).allTextContents();
    expect(rows.every((r) => r.includes('Decision record · Battery and energy'))).toBe(true);
    expect(rows.join('\n')).toContain('launch-day-checklist.md');
    // A preview of each draft's first lines.
    expect(rows.join('\n')).toContain('pod seal');
    await shot(page, 'import-done');
  });

  it('changes the kind of two drafts at once', async () => {
    const boxes = page.getByRole('checkbox', { name: /^Select “/ });
    expect(await boxes.count()).toBe(3);
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByText('Select all drafts (2 of 3 selected)').waitFor();
    await page.getByLabel('Kind').selectOption('lesson');
    await page.getByRole('button', { name: 'Change 2 selected' }).click();
    await page.getByText('Changed 2 drafts.').waitFor();
    await expect
      .poll(async () => (await imported(page).allTextContents()).filter((t) => t.includes('Lesson ·')).length)
      .toBe(2);
    // Still the same drafts after a reload: the change was stored.
    await page.reload();
    const after = await imported(page).allTextContents();
    expect(after.filter((t) => t.includes('Lesson · Battery and energy')).length).toBe(2);
    expect(after.filter((t) => t.includes('Decision record · Battery and energy')).length).toBe(1);
  });

  it('discards one draft after a confirmation', async () => {
    const boxes = page.getByRole('checkbox', { name: /^Select “/ });
    await boxes.nth(2).check();
    await page.getByRole('button', { name: 'Discard selected…' }).click();
    await page.getByRole('alertdialog').getByText('Discard 1 draft for good?').waitFor();
    await page.getByRole('button', { name: 'Yes, discard 1' }).click();
    await page.getByText('Discarded 1 draft.').waitFor();
    await expect.poll(() => page.getByRole('checkbox', { name: /^Select “/ }).count()).toBe(2);
    expect(await imported(page).filter({ hasText: 'Discarded' }).count()).toBe(1);
  });

  it('passes an axe check', async () => {
    await page.evaluate(AXE);
    const bad = (await page.evaluate(async () => {
      // @ts-expect-error injected above
      const r = await window.axe.run(document, { resultTypes: ['violations'] });
      return r.violations
        .filter((v: { impact: string }) => v.impact === 'serious' || v.impact === 'critical')
        .map((v: { id: string; nodes: { target: string[] }[] }) => `${v.id}: ${v.nodes[0]?.target.join(' ')}`);
    })) as string[];
    expect(bad).toEqual([]);
  });

  it('opens a draft in the editor', async () => {
    await Promise.all([
      page.waitForURL(/\/records\/[A-Za-z0-9_-]+\/edit$/),
      page
        .getByRole('link', { name: /^Open in the editor\b/ })
        .first()
        .click(),
    ]);
    await page.locator('.ProseMirror').waitFor();
  });

  it('lists the import on /import with its progress, and fits a phone', async () => {
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const p = await phone.newPage();
    await signIn(p, 'member@wakebook.test');
    await p.goto(`${baseUrl()}/import`);
    await p.getByRole('link', { name: /^3 files into Battery and energy/ }).waitFor();
    expect(await noSidewaysScroll(p)).toBe(true);
    await shot(p, 'import-phone');
    await p.goto(importUrl);
    await imported(p).first().waitFor();
    expect(await noSidewaysScroll(p)).toBe(true);
    await shot(p, 'import-review-phone');
    await phone.close();
  });

  it('keeps the list on /import current while an import runs, without a reload', async () => {
    const id = importUrl.split('/').pop()!;
    const db = new Database(inject('e2eDbPath'));
    const set = db.prepare('update imports set state = ?, done = ? where id = ?');
    try {
      // The import is made to look unfinished, as one still converting is: the page shows it so and keeps asking.
      set.run('running', 1, id);
      await page.goto(`${baseUrl()}/import`);
      const item = page.locator(`[data-import="${id}"]`);
      expect(await item.textContent()).toContain('1 of 3 done');
      set.run('done', 3, id);
      await expect.poll(() => item.textContent(), { timeout: 10_000 }).toContain('finished');
      expect(await item.locator('progress').evaluate((bar: HTMLProgressElement) => bar.value)).toBe(3);
    } finally {
      set.run('done', 3, id);
      db.close();
    }
  });

  it('is refused to an advisor with the 403 page', async () => {
    const other = await browser.newContext();
    const p = await other.newPage();
    await signIn(p, 'advisor@wakebook.test');
    const res = await p.goto(`${baseUrl()}/import`);
    expect(res?.status()).toBe(403);
    await p.getByRole('heading', { level: 1, name: /Only members and leads may open/ }).waitFor();
    const review = await p.goto(importUrl);
    expect(review?.status()).toBe(403);
    await other.close();
  });
});
