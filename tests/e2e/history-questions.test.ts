// The history page, the conflict view and questions, looked at in the real browser.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string, width = 1280, height = 900): Promise<{ ctx: BrowserContext; page: Page }> {
  const ctx = await browser.newContext({ viewport: { width, height } });
  const page = await ctx.newPage();
  await signIn(page, email);
  return { ctx, page };
}

const noSidewaysScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

interface Node {
  type: string;
  text?: string;
  content?: Node[];
  marks?: { type: string }[];
}

/** Comments load their JavaScript when they come into view: scroll there and wait until the island is live. */
async function commentsReady(page: Page) {
  await page.getByRole('heading', { name: /^Questions and notes/ }).scrollIntoViewIfNeeded();
  await page.locator('[data-island="records/Comments"][data-mounted]').waitFor({ state: 'attached' });
}

/** Edits a record through the API in the page's session: `change` rewrites its document in place. */
async function editRecord(page: Page, id: string, change: (doc: Node) => void, extra: Record<string, unknown> = {}) {
  const got = await page.request.get(`${baseUrl()}/api/records/${id}`);
  const { record } = await got.json();
  const body = record.body as Node;
  change(body);
  const res = await page.request.patch(`${baseUrl()}/api/records/${id}`, {
    data: { version: record.version, body, ...extra },
  });
  expect(res.status()).toBe(200);
}

function paragraphAfter(doc: Node, heading: string): Node {
  const i = doc.content!.findIndex((n) => n.type === 'heading' && n.content?.[0]?.text === heading);
  return doc.content!.slice(i + 1).find((n) => n.type === 'paragraph')!;
}

describe('history', () => {
  const ID = 'demo-rec-2526-dashboard-power-target';

  it('shows a version beside its predecessor with word-level insertions, deletions and a formatting change', async () => {
    const { ctx, page } = await signedIn('lead@wakebook.test');
    await editRecord(page, ID, (doc) => {
      const p = paragraphAfter(doc, 'Decision');
      const first = p.content!.find((c) => c.type === 'text')!;
      first.text = `Proposal, reworded: ${first.text!.split(' ').slice(2).join(' ')}`;
      p.content!.push({ type: 'text', text: ' Check the hinge pins monthly.', marks: [{ type: 'bold' }] });
    });
    await page.goto(`${baseUrl()}/records/${ID}/history`);
    await page.getByRole('heading', { level: 1, name: /History of/ }).waitFor();
    // The newest version opens beside the one before it.
    await page.getByRole('heading', { level: 2, name: 'Version 2, beside version 1' }).waitFor();
    const article = page.locator('article');
    expect(await article.locator('ins', { hasText: 'Proposal, reworded' }).count()).toBe(1);
    expect(await article.locator('ins', { hasText: 'Check the hinge pins monthly.' }).count()).toBe(1);
    expect(await article.locator('del').count()).toBeGreaterThan(0);
    // The changed paragraph sits inside a block that shows version 1 and version 2 side by side.
    const changed = article.locator('[data-change="changed"]');
    expect(await changed.count()).toBe(1);
    expect(await changed.textContent()).toContain('Version 1');
    // The version strip says who, when and what changed.
    const strip = page.getByRole('link', { name: /^Version 2/ });
    expect(await strip.textContent()).toContain('Maren Kowalczyk');
    await shot(page, 'history-word-changes');

    // A status change is a change of its own.
    const status = await page.request.post(`${baseUrl()}/api/records/${ID}/status`, { data: { status: 'withdrawn' } });
    expect(status.status()).toBe(200);
    await page.goto(`${baseUrl()}/records/${ID}/history`);
    const changes = page.getByRole('list', { name: 'What this version changed' });
    expect(await changes.textContent()).toMatch(/Status:.*Proposed.*Withdrawn/);
    await ctx.close();
  });

  it('has no sideways scroll at 390 px', async () => {
    const { ctx, page } = await signedIn('member@wakebook.test', 390, 844);
    await page.goto(`${baseUrl()}/records/${ID}/history?v=2`);
    await page.getByRole('heading', { level: 2, name: 'Version 2, beside version 1' }).waitFor();
    expect(await noSidewaysScroll(page)).toBe(true);
    await shot(page, 'history-phone');
    await ctx.close();
  });

  it('a single-version record shows its text once, and its dates agree with the facts panel', async () => {
    const { ctx, page } = await signedIn('member@wakebook.test');
    const one = 'demo-rec-2425-cell-drift';
    await page.goto(`${baseUrl()}/records/${one}`);
    const facts = await page.getByRole('complementary', { name: 'About this record' }).textContent();
    await page.goto(`${baseUrl()}/records/${one}/history`);
    await page.getByRole('heading', { level: 2, name: 'Version 1' }).waitFor();
    const text = await page.locator('main').innerText();
    const sentence = 'Capacity-test every cell at the start of each season';
    expect(text.split(sentence).length - 1).toBe(1);
    expect(await page.locator('main ins, main del').count()).toBe(0);
    expect(text).toContain('the only version so far');
    // The demo wrote this lesson on 2025-05-19; the facts panel and the history say the same day.
    expect(text).toContain('2025-05-19');
    expect(facts).toContain('1, 2025-05-19');
    await shot(page, 'history-single-version');
    await ctx.close();
  });
});

describe('the conflict view', () => {
  it('leads with the sections that differ, highlighted, and merges per section', async () => {
    const ID = 'demo-rec-2526-throttle-soft-start';
    const a = await signedIn('lead@wakebook.test');
    const b = await signedIn('member@wakebook.test', 1280, 800);
    for (const p of [a.page, b.page]) {
      await p.goto(`${baseUrl()}/records/${ID}/edit`);
      await p.locator('.ProseMirror').waitFor();
    }
    const typeAtEnd = async (p: Page, heading: string, text: string) => {
      await p.locator('.ProseMirror h2', { hasText: heading }).locator('xpath=following-sibling::p[1]').click();
      await p.keyboard.press('End');
      await p.keyboard.type(text);
    };
    await typeAtEnd(a.page, 'Context', ' Lead: ten starts are enough.');
    await a.page.getByRole('button', { name: 'Save changes' }).click();
    await a.page.getByText(/Saved as version \d+/).waitFor();

    await typeAtEnd(b.page, 'Decision', ' Member: film from the pontoon.');
    await b.page.getByRole('button', { name: 'Save changes' }).click();
    const view = b.page.getByTestId('conflict-view');
    await view.waitFor();
    await b.page.getByRole('heading', { name: /was saved by Maren Kowalczyk while you edited/ }).waitFor();
    // The first sections shown are the two that differ, in the text's order, with the words marked.
    const sections = view.locator('fieldset[data-section]');
    expect(await sections.evaluateAll((els) => els.map((e) => e.getAttribute('data-section')))).toEqual([
      'Context',
      'Decision',
    ]);
    expect(await sections.nth(0).locator('del', { hasText: 'Lead: ten starts are enough.' }).count()).toBe(1);
    expect(await sections.nth(1).locator('ins', { hasText: 'Member: film from the pontoon.' }).count()).toBe(1);
    // Above the fold: the first differing section starts inside the window.
    const box = await sections.nth(0).boundingBox();
    expect(box!.y).toBeGreaterThanOrEqual(0);
    expect(box!.y).toBeLessThan(800);
    await shot(b.page, 'conflict-view');

    // Take theirs for Context, keep mine for Decision: both texts survive.
    await sections.nth(0).getByLabel('Take theirs').check();
    await b.page.getByRole('button', { name: 'Put these choices in the editor' }).click();
    const merged = await b.page.locator('.ProseMirror').textContent();
    expect(merged).toContain('Lead: ten starts are enough.');
    expect(merged).toContain('Member: film from the pontoon.');
    await b.page.getByRole('button', { name: 'Save changes' }).click();
    await b.page.getByText(/Saved as version \d+/).waitFor();
    await a.ctx.close();
    await b.ctx.close();
  });
});

describe('questions', () => {
  it('the alumni home page shows the questions waiting for them; /questions lists them by subsystem', async () => {
    const { ctx, page } = await signedIn('alumni@wakebook.test');
    await page.goto(`${baseUrl()}/`);
    const forYou = page.getByRole('region', { name: 'Questions for you' });
    expect(await forYou.textContent()).toContain('at 2300 rpm');
    await shot(page, 'home-alumni-questions');
    await page.getByRole('link', { name: 'Questions', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Open questions' }).waitFor();
    expect(await page.getByRole('heading', { level: 2, name: /Propulsion and motor drive/ }).count()).toBe(1);
    expect(await noSidewaysScroll(page)).toBe(true);
    await shot(page, 'questions-open');
    await page.getByRole('link', { name: 'Answered' }).click();
    await page.getByRole('heading', { level: 1, name: 'Answered questions' }).waitFor();
    await ctx.close();
  });

  it('a member asks on a record, an alumnus answers, the asker marks it answered', async () => {
    const ID = 'demo-rec-2526-parts-lead-time'; // propulsion, written by the lead; Priya owned propulsion before
    const m = await signedIn('member@wakebook.test');
    await m.page.goto(`${baseUrl()}/records/${ID}`);
    await commentsReady(m.page);
    await m.page
      .getByLabel('Ask a question or add a note')
      .fill('Which foundry cast the 2025 propeller, and what did they quote?');
    await m.page.getByRole('button', { name: 'Ask', exact: true }).click();
    const item = m.page.getByRole('listitem', { name: 'Question from Jonas Lindqvist' }).last();
    await item.getByText('Open question').waitFor();

    const al = await signedIn('alumni@wakebook.test', 390, 844);
    await al.page.goto(`${baseUrl()}/`);
    expect(await al.page.getByRole('region', { name: 'Questions for you' }).textContent()).toContain(
      'Which foundry cast',
    );
    await shot(al.page, 'home-alumni-phone');
    await al.page.goto(`${baseUrl()}/records/${ID}`);
    await commentsReady(al.page);
    const q = al.page.getByRole('listitem', { name: 'Question from Jonas Lindqvist' }).last();
    await q.getByRole('button', { name: 'Answer' }).click();
    await q.getByRole('textbox').fill('A small foundry by the harbour; six weeks quoted, nine taken.');
    await q.getByRole('button', { name: 'Post answer' }).click();
    await q.getByText('A small foundry by the harbour; six weeks quoted, nine taken.').waitFor();
    // Alumni may not mark someone else's question answered: no button.
    expect(await q.getByRole('button', { name: 'Mark answered' }).count()).toBe(0);

    await m.page.reload();
    await commentsReady(m.page);
    const mine = m.page.getByRole('listitem', { name: 'Question from Jonas Lindqvist' }).last();
    await mine.getByRole('button', { name: 'Mark answered' }).click();
    await mine.getByText('Answered question').waitFor();
    await shot(m.page, 'record-question-answered');
    await m.page.goto(`${baseUrl()}/`);
    await shot(m.page, 'home-member');
    await m.ctx.close();
    await al.ctx.close();
  });

  it('the account page has the two e-mail switches', async () => {
    const { ctx, page } = await signedIn('alumni@wakebook.test');
    await page.goto(`${baseUrl()}/account`);
    const box = page.getByLabel(/E-mail me new questions/);
    await page.locator('[data-island][data-mounted]').first().waitFor({ state: 'attached' });
    await box.uncheck();
    await page.getByText('No e-mails about new questions').waitFor();
    await page.reload();
    expect(await page.getByLabel(/E-mail me new questions/).isChecked()).toBe(false);
    await page.getByLabel(/E-mail me new questions/).check();
    await page.getByText('New questions that may concern you will come by e-mail.').waitFor();
    await ctx.close();
  });
});
