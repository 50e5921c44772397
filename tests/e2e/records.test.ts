import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
let ctx: BrowserContext;
let page: Page;
let recordUrl = '';

beforeAll(async () => {
  browser = await launch();
  ctx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  page = await ctx.newPage();
  await signIn(page, 'member@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

async function typeInSection(p: Page, heading: string, text: string) {
  // Click the prompt paragraph under a section heading and replace it.
  const prompt = p.locator('.ProseMirror h2', { hasText: heading }).locator('xpath=following-sibling::p[1]');
  await prompt.click();
  await p.keyboard.press('End');
  await p.keyboard.press('Shift+Home');
  await p.keyboard.type(text);
}

describe('decision records in the browser', () => {
  it('writes a decision in the editor, links a calculation, saves and sees it rendered', async () => {
    await page.goto(`${baseUrl()}/records`);
    await page.getByRole('link', { name: 'New decision record' }).click();
    await page.getByLabel('Title').fill('Fuse the main battery lead at 80 A');
    await page.getByLabel('Subsystem').selectOption('battery');
    await page.locator('.ProseMirror h2', { hasText: 'Context' }).waitFor();
    await typeInSection(page, 'Context', 'The main lead runs 4 m from the pack to the controller.');
    await typeInSection(page, 'Decision', 'An 80 A fuse at the pack end.');
    const picker = page.getByRole('group', { name: /Linked calculations/ });
    await picker.getByPlaceholder('Filter by title…').fill('Main battery lead');
    // Each calculation is named with its calculator's name, not its kind key.
    const option = picker.locator('label', { has: page.getByRole('checkbox') }).first();
    expect(await option.textContent()).toContain('Cable voltage drop ·');
    await picker.getByRole('checkbox').first().check();
    await Promise.all([
      page.waitForURL(/\/records\/[a-z2-7]{16}$/),
      page.getByRole('button', { name: 'Create decision record' }).click(),
    ]);
    recordUrl = page.url();
    await page.getByRole('heading', { level: 1, name: 'Fuse the main battery lead at 80 A' }).waitFor();
    expect(await page.locator('article .prose-wb').textContent()).toContain('An 80 A fuse at the pack end.');
    expect(await page.getByRole('complementary', { name: 'About this record' }).textContent()).toContain(
      'Main battery lead',
    );
    await shot(page, 'record-new-decision');
  });

  it('keeps unsaved text across a reload (local draft)', async () => {
    await page.goto(`${recordUrl}/edit`);
    await page.locator('.ProseMirror').waitFor();
    await typeInSection(page, 'Consequences', 'Draft text that must survive a reload.');
    await page.waitForTimeout(800);
    page.once('dialog', (d) => d.accept()); // the leave-with-unsaved-edits warning
    await page.reload();
    await page.getByRole('button', { name: 'Restore them' }).click();
    expect(await page.locator('.ProseMirror').textContent()).toContain('Draft text that must survive a reload.');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText(/Saved as version 2/).waitFor();
  });

  it('two tabs edit the same version: the second save meets a conflict and merges without losing either text', async () => {
    const tabA = page;
    const tabB = await ctx.newPage();
    await tabA.goto(`${recordUrl}/edit`);
    await tabB.goto(`${recordUrl}/edit`);
    await tabA.locator('.ProseMirror').waitFor();
    await tabB.locator('.ProseMirror').waitFor();
    await typeInSection(tabA, 'Options considered', 'Tab A: a 100 A fuse.');
    await tabA.getByRole('button', { name: 'Save changes' }).click();
    await tabA.getByText(/Saved as version 3/).waitFor();
    await typeInSection(tabB, 'Options considered', 'Tab B: a breaker instead.');
    await tabB.getByRole('button', { name: 'Save changes' }).click();
    await tabB.getByTestId('conflict-view').waitFor();
    await shot(tabB, 'record-conflict');
    const section = tabB.locator('fieldset[data-section="Options considered"]');
    await section.getByLabel('Merge both').check();
    await tabB.getByRole('button', { name: 'Put these choices in the editor' }).click();
    const merged = await tabB.locator('.ProseMirror').textContent();
    expect(merged).toContain('Tab A: a 100 A fuse.');
    expect(merged).toContain('Tab B: a breaker instead.');
    await tabB.getByRole('button', { name: 'Save changes' }).click();
    await tabB.getByText(/Saved as version 4/).waitFor();
    await tabB.close();
    await page.goto(`${recordUrl}/history`);
    expect(await page.getByRole('link', { name: /^Version \d/ }).count()).toBe(4);
  });

  it('uploads an image and a CSV log and sees them on the record', async () => {
    await page.goto(recordUrl);
    await page.getByText('Drop photos, PDFs').scrollIntoViewIfNeeded();
    // Wait until the island has hydrated (Astro removes the ssr attribute), so the change event is heard.
    await page.locator('astro-island:not([ssr]) input[aria-label="Attach files"]').waitFor({ state: 'attached' });
    const input = page.getByLabel('Attach files');
    await input.setInputFiles([
      {
        name: 'loop.png',
        mimeType: 'image/png',
        buffer: readFileSync('content/demo/attachments/coolant-loop-schematic-2025-12.png'),
      },
      {
        name: 'current-log.csv',
        mimeType: 'text/csv',
        buffer: Buffer.from('time_s,current_A,voltage_V\n0,10,48\n1,60,47.1\n2,80,46.5\n3,75,46.7\n'),
      },
    ]);
    // Both appear where they were dropped, without a reload: the image, and the log plotted with its column picker.
    await page.getByRole('img', { name: 'Attached image loop.png' }).waitFor();
    const added = page.getByRole('region', { name: 'Just attached' });
    await added.getByLabel('Along (x)').scrollIntoViewIfNeeded();
    await added.locator('canvas').first().waitFor();
    // Column choices read as words with units; the header as written stays in the title.
    const voltage = added.getByLabel('Voltage (V)');
    expect(await voltage.isChecked()).toBe(true);
    expect(await added.locator('label[title="voltage_V"]').textContent()).toBe('Voltage (V)');
    expect(await added.getByLabel('Along (x)').locator('option:checked').textContent()).toBe('Time (s)');
    // and they stay: after a reload the record lists the log once
    await page.reload();
    expect(await page.getByRole('link', { name: 'current-log.csv' }).count()).toBe(1);
    await shot(page, 'record-attachments');
  });

  /** The member proposes (past the thin-decision warning); an advisor, in a browser of their own, accepts. */
  async function proposeAndAccept(url: string) {
    await page.goto(url);
    await page.getByRole('button', { name: /Propose to the team/ }).click();
    // A decision with nothing under its options or consequences asks once more.
    const anyway = page.getByRole('button', { name: 'Propose it anyway' });
    const waiting = page.getByText('Waiting for a review');
    await anyway.or(waiting).first().waitFor();
    if (await anyway.isVisible()) await anyway.click();
    await waiting.waitFor();
    const advisorCtx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
    const advisor = await advisorCtx.newPage();
    await signIn(advisor, 'advisor@wakebook.test');
    await advisor.goto(url);
    await advisor.getByRole('button', { name: /Mark accepted/ }).click();
    await advisor.getByText('To be accepted').waitFor({ state: 'detached' });
    await advisorCtx.close();
  }

  it('supersedes it with a newer record; both show the link', async () => {
    const id = recordUrl.split('/').pop()!;
    // Move the first decision to accepted so it can be superseded.
    await proposeAndAccept(recordUrl);
    await page.goto(recordUrl);
    await page.getByRole('button', { name: /Supersede/ }).waitFor();
    // Write the replacement.
    await page.goto(`${baseUrl()}/records/new?kind=decision&subsystem=battery`);
    await page.getByLabel('Title').fill('Use a 100 A breaker instead of the fuse');
    await page.locator('.ProseMirror h2', { hasText: 'Decision' }).waitFor();
    await typeInSection(page, 'Decision', 'A resettable breaker, after the bench test.');
    await Promise.all([
      page.waitForURL(/\/records\/[a-z2-7]{16}$/),
      page.getByRole('button', { name: 'Create decision record' }).click(),
    ]);
    const newerUrl = page.url();
    // Only an accepted decision can replace one.
    await proposeAndAccept(newerUrl);
    await page.goto(recordUrl);
    await page.getByRole('button', { name: /Supersede/ }).click();
    const select = page.getByLabel('Which decision replaces this one?');
    await select.locator('option', { hasText: 'Use a 100 A breaker' }).waitFor({ state: 'attached' });
    await select.selectOption(newerUrl.split('/').pop()!);
    await page.getByRole('button', { name: 'Supersede', exact: true }).click();
    await page.getByText('Superseded by').waitFor();
    expect(await page.getByRole('complementary', { name: 'About this record' }).textContent()).toContain(
      'Replaced by Use a 100 A breaker',
    );
    await page.goto(newerUrl);
    expect(await page.getByRole('complementary', { name: 'About this record' }).textContent()).toContain(
      'Replaces Fuse the main battery lead',
    );
    expect(id).toMatch(/^[a-z2-7]{16}$/);
    await shot(page, 'record-superseding');
  });
});
