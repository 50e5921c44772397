// Writing and review in the browser (issue 13, sections 1 and 2): prompts that are shown but never saved, the
// editor's focus ring, a change note, discarding a draft, and a decision waiting for a review until an advisor acts.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
let memberCtx: BrowserContext;
let member: Page;
let recordUrl = '';

beforeAll(async () => {
  browser = await launch();
  memberCtx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  member = await memberCtx.newPage();
  await signIn(member, 'member@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

async function pageAs(email: string, width = 1280): Promise<Page> {
  const ctx = await browser.newContext({ viewport: { width, height: 1000 } });
  const p = await ctx.newPage();
  await signIn(p, email);
  return p;
}

const section = (p: Page, heading: string) =>
  p.locator('.ProseMirror h2', { hasText: heading }).locator('xpath=following-sibling::p[1]');
const apiJson = async (p: Page, path: string) => {
  const res = await p.request.get(`${baseUrl()}${path}`);
  return { status: res.status(), body: res.status() === 200 ? await res.json() : null };
};

describe('writing a decision', () => {
  it('shows each section’s prompt as a placeholder that is never saved, with a visible focus ring', async () => {
    await member.goto(`${baseUrl()}/records/new?kind=decision&subsystem=solar`);
    await member.locator('.ProseMirror h2', { hasText: 'Context' }).waitFor();
    const prompts = member.locator('.ProseMirror p.section-prompt');
    expect(await prompts.count()).toBe(4);
    // The prompt is drawn by CSS from the decoration, not typed into the document.
    const shown = await section(member, 'Options considered').evaluate(
      (el) => getComputedStyle(el, '::before').content,
    );
    expect(shown).toContain('Each option you looked at');
    expect(await section(member, 'Options considered').textContent()).toBe('');
    await shot(member, 'editor-prompts');

    await section(member, 'Context').click();
    const ring = await member
      .locator('.editor-frame')
      .evaluate((el) => ({ style: getComputedStyle(el).outlineStyle, width: getComputedStyle(el).outlineWidth }));
    expect(ring).toEqual({ style: 'solid', width: '3px' });
    await member.keyboard.type('The array charges at noon only; the shore charger is 200 W.');
    // Its own prompt is gone as soon as the section has text; the other sections keep theirs.
    expect(await prompts.count()).toBe(3);
    await shot(member, 'editor-typing-focus');

    await member.getByLabel('Title').fill('Charge from the shore at 400 W between heats');
    await Promise.all([
      member.waitForURL(/\/records\/[a-z2-7]{16}$/),
      member.getByRole('button', { name: 'Create decision record' }).click(),
    ]);
    recordUrl = member.url();
    const id = recordUrl.split('/').pop()!;
    const stored = JSON.stringify((await apiJson(member, `/api/records/${id}`)).body.record.body);
    expect(stored).toContain('The array charges at noon only');
    expect(stored).not.toContain('italic');
    expect(stored).not.toContain('Each option you looked at');
    expect(stored).not.toContain('What problem were you solving');
  });

  it('an edit carries a change note, listed with its version', async () => {
    await member.goto(`${recordUrl}/edit`);
    await member.locator('.ProseMirror').waitFor();
    // A reopened record shows the prompts of its still-empty sections again.
    expect(await member.locator('.ProseMirror p.section-prompt').count()).toBe(3);
    await section(member, 'Decision').click();
    await member.keyboard.type('A 400 W charger on the pontoon, fused at the plug.');
    await member.getByLabel(/Why this change/).fill('Wrote down what we chose after the heat on Saturday.');
    await shot(member, 'editor-change-note');
    await member.getByRole('button', { name: 'Save changes' }).click();
    await member.getByText('Saved as version 2.').waitFor();
    expect(await member.getByLabel(/Why this change/).inputValue()).toBe('');
    const id = recordUrl.split('/').pop()!;
    const revs = (await apiJson(member, `/api/records/${id}/revisions`)).body.revisions;
    expect(revs[0]).toMatchObject({
      version: 2,
      status: 'draft',
      changeNote: 'Wrote down what we chose after the heat on Saturday.',
    });
  });

  it('discards a draft after a confirmation; it is gone', async () => {
    const made = await member.request.post(`${baseUrl()}/api/records`, {
      data: {
        kind: 'decision',
        title: 'Paint the hull number on both sides',
        subsystem: 'hull',
        body: { type: 'doc', content: [{ type: 'paragraph' }] },
      },
    });
    expect(made.status()).toBe(201);
    const { record } = await made.json();
    await member.goto(`${baseUrl()}${record.url}`);
    await member.getByRole('button', { name: 'Discard draft' }).click();
    await member.getByText('Discard the draft “Paint the hull number on both sides” for good?').waitFor();
    await shot(member, 'record-discard-confirm');
    // Keeping it is one step back.
    await member.getByRole('button', { name: 'Keep the draft' }).click();
    await member.getByRole('button', { name: 'Discard draft' }).click();
    await Promise.all([
      member.waitForURL(/\/records$/),
      member.getByRole('button', { name: 'Yes, discard it' }).click(),
    ]);
    expect((await apiJson(member, `/api/records/${record.id}`)).status).toBe(404);
    // Past draft, the button is not offered.
    await member.goto(`${baseUrl()}/records/demo-rec-2526-throttle-soft-start`);
    expect(await member.getByRole('button', { name: 'Discard draft' }).count()).toBe(0);
  });
});

describe('review before acceptance', () => {
  it('a thin decision is flagged before it is proposed; then it waits for a review the member cannot skip', async () => {
    await member.goto(recordUrl);
    await member.getByRole('button', { name: /Propose to the team/ }).click();
    const warning = member.getByRole('note');
    await warning.getByText('A thin decision').waitFor();
    expect(await warning.textContent()).toContain('“Options considered” and “Consequences”');
    await shot(member, 'record-thin-warning');
    await member.getByRole('button', { name: 'Propose it anyway' }).click();
    await member.getByText('Waiting for a review').waitFor();
    const accept = member.getByRole('button', { name: /Mark accepted/ });
    expect(await accept.isDisabled()).toBe(true);
    expect(await member.getByRole('complementary', { name: 'About this record' }).textContent()).toContain(
      'Accepting needs a review of this version by an advisor or a lead first.',
    );
    await shot(member, 'record-waiting-member');
  });

  it('the advisor finds it on their home page, reviews it, and the member can then accept it', async () => {
    const advisor = await pageAs('advisor@wakebook.test');
    await advisor.goto(`${baseUrl()}/`);
    const queue = advisor.getByRole('region', { name: /Decisions waiting for your review/ });
    await queue.getByRole('link', { name: 'Charge from the shore at 400 W between heats' }).waitFor();
    expect(await queue.getByRole('link', { name: /Ramp the throttle over 0.8 s/ }).count()).toBe(1);
    await shot(advisor, 'home-advisor-queue');
    await queue.getByRole('link', { name: 'Charge from the shore at 400 W between heats' }).click();
    await advisor.getByText('Waiting for a review').waitFor();
    // Advisors decide on decisions but never edit them.
    expect(await advisor.getByRole('link', { name: 'Edit', exact: true }).count()).toBe(0);
    await shot(advisor, 'record-waiting-advisor');
    await advisor.getByLabel(/Review note/).fill('Add the options you weighed before the next heat.');
    await advisor.getByRole('button', { name: /Mark version 3 reviewed/ }).click();
    await advisor.getByText('Reviewed: ready to be accepted.').waitFor();
    await advisor.goto(`${baseUrl()}/`);
    expect(
      await advisor
        .getByRole('region', { name: /Decisions waiting for your review/ })
        .getByRole('link', { name: 'Charge from the shore at 400 W between heats' })
        .count(),
    ).toBe(0);
    await advisor.context().close();

    await member.goto(recordUrl);
    await member.getByText('Reviewed: ready to be accepted.').waitFor();
    await member.getByRole('button', { name: /Mark accepted/ }).click();
    await member.getByText('To be accepted').waitFor({ state: 'detached' });
    expect(await member.locator('header .status').first().textContent()).toContain('Accepted');
    await shot(member, 'record-accepted-member');
  });

  it('a lead sees the same queue and record page (screenshots at desktop and phone width)', async () => {
    const lead = await pageAs('lead@wakebook.test');
    await lead.goto(`${baseUrl()}/`);
    await lead.getByRole('region', { name: /Decisions waiting for your review/ }).waitFor();
    await shot(lead, 'home-lead-queue');
    await lead.goto(`${baseUrl()}/records/demo-rec-2526-throttle-soft-start`);
    await lead.getByText('Waiting for a review').waitFor();
    await shot(lead, 'record-waiting-lead');
    await lead.context().close();
    const phone = await pageAs('advisor@wakebook.test', 390);
    await phone.goto(`${baseUrl()}/records/demo-rec-2526-throttle-soft-start`);
    await phone.getByText('Waiting for a review').waitFor();
    expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(phone, 'record-waiting-advisor-phone');
    await phone.context().close();
  });
});
