// Writing with no network: a change is kept in this browser's outbox, shown in the header and at /pending, and sent
// once when the network is back — exactly once, even when the answer to the first send was lost; a conflicting
// offline edit opens the merge view.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { request as http, type APIRequestContext, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn, DEMO_PASSWORD } from './browser';

let browser: Browser;
let ctx: BrowserContext;
let page: Page;
let lead: APIRequestContext;

const KEPT = 'Kept on this device — it will be sent when you are back online.';

beforeAll(async () => {
  browser = await launch();
  ctx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  page = await ctx.newPage();
  await signIn(page, 'member@wakebook.test');
  // The service worker keeps the pages this person opens; wait until it controls the page.
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  lead = await http.newContext({ baseURL: baseUrl() });
  const res = await lead.post('/api/auth/sign-in', { data: { email: 'lead@wakebook.test', password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
});
afterAll(async () => {
  await lead?.dispose();
  await browser?.close();
});

async function typeInSection(p: Page, heading: string, text: string) {
  const prompt = p.locator('.ProseMirror h2', { hasText: heading }).locator('xpath=following-sibling::p[1]');
  await prompt.click();
  await p.keyboard.press('End');
  await p.keyboard.press('Shift+Home');
  await p.keyboard.type(text);
}

/** How many lessons the server has with this title (read as the lead, through the API). */
async function lessonsTitled(title: string): Promise<number> {
  const res = await lead.get('/api/records?kind=lesson&limit=100');
  expect(res.status()).toBe(200);
  const { records } = (await res.json()) as { records: { title: string }[] };
  return records.filter((r) => r.title === title).length;
}

/** The question form, once its island has hydrated (typing before that would be lost). */
async function commentForm(p: Page) {
  await p.getByRole('heading', { name: /^Questions and notes/ }).scrollIntoViewIfNeeded();
  await p.locator('[data-island="records/Comments"][data-mounted]').waitFor({ state: 'attached' });
  return p.getByLabel('Ask a question or add a note');
}

const indicator = () => page.locator('#outbox-status');

async function waitForEmptyOutbox(p: Page) {
  await p.waitForFunction(async () => {
    const person = document.documentElement.dataset.person;
    const open = indexedDB.open(`wakebook-outbox-${person}`);
    const db = await new Promise<IDBDatabase>((resolve) => (open.onsuccess = () => resolve(open.result)));
    if (!db.objectStoreNames.contains('changes')) return (db.close(), true);
    const all = db.transaction('changes').objectStore('changes').count();
    const n = await new Promise<number>((resolve) => (all.onsuccess = () => resolve(all.result)));
    db.close();
    return n === 0;
  });
}

describe('writing offline', () => {
  it('a lesson written offline is kept, listed, and sent exactly once when the network is back', async () => {
    const title = 'Offline lesson: shore power lead chafed on the pontoon';
    // Opened online first, so both pages are kept on this device.
    await page.goto(`${baseUrl()}/pending`);
    await page.getByText('Nothing waiting').waitFor();
    await page.goto(`${baseUrl()}/records/new?kind=lesson&subsystem=battery`);
    await page.locator('.ProseMirror h2').first().waitFor();

    await ctx.setOffline(true);
    await page.getByLabel('Title').fill(title);
    await typeInSection(page, 'What happened', 'The lead rubbed through its sleeve on the pontoon edge.');
    await page.getByRole('button', { name: 'Create lesson' }).click();
    await page.getByText(KEPT).waitFor();
    await expect.poll(() => indicator().textContent()).toBe('Offline — 1 change kept');
    expect(await lessonsTitled(title)).toBe(0); // the API is read outside the browser: nothing has arrived

    // The outbox page, itself read from this device's copy.
    await indicator().click();
    await page.waitForURL(/\/pending$/);
    const entry = page.locator('[data-outbox-entry]');
    await entry.first().waitFor();
    expect(await entry.count()).toBe(1);
    expect(await entry.textContent()).toContain(`New lesson ‘${title}’`);
    expect(await entry.textContent()).toContain('Waiting to be sent');
    await shot(page, 'offline-writes-pending');

    await ctx.setOffline(false);
    await page.getByText('Nothing waiting').waitFor();
    await expect.poll(() => lessonsTitled(title)).toBe(1);
    // The header said so, then went quiet.
    await expect.poll(() => indicator().isHidden(), { timeout: 10_000 }).toBe(true);
    await page.reload();
    await page.getByText('Nothing waiting').waitFor();
    expect(await lessonsTitled(title)).toBe(1);
  });

  it('a lost answer does not make a second lesson: the retry carries the same key', async () => {
    const title = 'Lost answer lesson: the ballast bag leaked';
    await page.goto(`${baseUrl()}/records/new?kind=lesson&subsystem=hull`);
    await page.locator('.ProseMirror h2').first().waitFor();
    let posts = 0;
    const keys: string[] = [];
    // The first POST reaches the server, but the browser is told the network failed.
    await page.route('**/api/records', async (route) => {
      if (route.request().method() !== 'POST') return route.continue();
      posts += 1;
      keys.push(route.request().headers()['idempotency-key'] ?? '');
      if (posts === 1) {
        const answer = await route.fetch();
        expect(answer.status()).toBe(201);
        return route.abort('internetdisconnected');
      }
      return route.continue();
    });
    await page.getByLabel('Title').fill(title);
    await typeInSection(page, 'What happened', 'Water found its way into the aft bag.');
    await page.getByRole('button', { name: 'Create lesson' }).click();
    await page.getByText(KEPT).waitFor();
    expect(await lessonsTitled(title)).toBe(1); // the server did make it

    // The next page load sends what is waiting.
    await page.goto(`${baseUrl()}/pending`);
    await page.getByText('Nothing waiting').waitFor();
    await page.unroute('**/api/records');
    // Sent again at least once (at once when the outbox woke, again if a page change cut that send short), and
    // every time under the first key.
    expect(posts).toBeGreaterThanOrEqual(2);
    expect(keys[0]).toMatch(/^[A-Za-z0-9_-]{8,128}$/);
    expect(new Set(keys)).toEqual(new Set([keys[0]]));
    expect(await lessonsTitled(title)).toBe(1);
  });

  it('an edit made offline that meets a newer version opens the merge view', async () => {
    // Not the cooling record: tests/e2e/offline.test.ts reads that one by its title on the same server.
    const id = 'demo-rec-2526-sprint-prop-ventilation-launch';
    await page.goto(`${baseUrl()}/records/${id}/edit`);
    await page.locator('.ProseMirror h2').first().waitFor();
    const before = (await (await lead.get(`/api/records/${id}`)).json()) as {
      record: { version: number; title: string };
    };

    await ctx.setOffline(true);
    await page.getByLabel('Title').fill('Sprint propeller ventilation (member’s offline edit)');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText(KEPT).waitFor();

    // Meanwhile the lead changes the same record.
    const patched = await lead.patch(`/api/records/${id}`, {
      data: { version: before.record.version, title: 'Sprint propeller ventilation (lead’s edit)' },
    });
    expect(patched.status()).toBe(200);

    await page.goto(`${baseUrl()}/pending`).catch(() => undefined);
    await page.locator('[data-outbox-entry="waiting"]').waitFor();
    await ctx.setOffline(false);
    await page.locator('[data-outbox-entry="conflict"]').waitFor();
    await expect.poll(() => indicator().textContent()).toBe('1 change needs you');
    expect(await page.locator('[data-outbox-entry="conflict"]').textContent()).toContain(
      `Edit of ‘${before.record.title}’`,
    );

    await page.getByRole('link', { name: 'Resolve' }).click();
    await page.waitForURL(/\/edit\?outbox=/);
    const view = page.getByTestId('conflict-view');
    await view.waitFor();
    expect(await view.getByRole('heading', { level: 2 }).textContent()).toContain(
      `Version ${before.record.version + 1} was saved by`,
    );
    expect(await page.getByLabel('Title').inputValue()).toBe('Sprint propeller ventilation (member’s offline edit)');
    await shot(page, 'offline-writes-conflict');

    await view.getByRole('button', { name: 'Save all of mine as the newer version' }).click();
    await page.getByText(`Saved as version ${before.record.version + 2}.`).waitFor();
    const after = (await (await lead.get(`/api/records/${id}`)).json()) as { record: { title: string } };
    expect(after.record.title).toBe('Sprint propeller ventilation (member’s offline edit)');
    await waitForEmptyOutbox(page);
  });

  it('a question asked offline is posted once on reconnect', async () => {
    const id = 'demo-rec-2526-bms-cell-logging';
    const question = 'Offline question: which logger firmware was on the pack at the regatta?';
    await page.goto(`${baseUrl()}/records/${id}`);
    const form = await commentForm(page);
    await ctx.setOffline(true);
    await form.fill(question);
    await page.getByRole('button', { name: 'Ask', exact: true }).click();
    await page.getByText(KEPT).waitFor();
    await expect.poll(() => indicator().textContent()).toBe('Offline — 1 change kept');

    await ctx.setOffline(false);
    await expect.poll(() => indicator().textContent()).toBe('All changes sent');
    const res = await lead.get(`/api/records/${id}/comments`);
    const { comments } = (await res.json()) as { comments: { body: string; kind: string }[] };
    expect(comments.filter((c) => c.body === question)).toHaveLength(1);
    expect(comments.find((c) => c.body === question)?.kind).toBe('question');
    await page.reload();
    await page.getByText(question).waitFor();
  });

  it('an onboarding tick made offline is saved on reconnect', async () => {
    const route = async () =>
      (await (await page.request.get(`${baseUrl()}/api/onboarding/propulsion`)).json()) as {
        items: { title: string; done: boolean }[];
      };
    const item = (await route()).items.find((i) => !i.done);
    expect(item).toBeDefined();
    await page.goto(`${baseUrl()}/subsystems/propulsion`);
    await page
      .locator('[data-island="onboarding/RouteChecklist"][data-mounted] input[type="checkbox"]')
      .first()
      .waitFor({ state: 'attached' });
    await ctx.setOffline(true);
    await page.getByRole('checkbox', { name: `Done: ${item!.title}` }).check();
    await page.getByText(KEPT).waitFor();
    expect(await page.getByRole('checkbox', { name: `Done: ${item!.title}` }).isChecked()).toBe(true);
    await ctx.setOffline(false);
    await expect.poll(async () => (await route()).items.find((i) => i.title === item!.title)?.done).toBe(true);
    await waitForEmptyOutbox(page);
  });

  it('signing out with a change still waiting asks first', async () => {
    await page.goto(`${baseUrl()}/records/demo-rec-2526-bms-cell-logging`);
    const form = await commentForm(page);
    await ctx.setOffline(true);
    await form.fill('A note that is never sent');
    await page.getByRole('button', { name: 'Add as a note' }).click();
    await page.getByText(KEPT).waitFor();
    // Back online, but the send does not get through (its route is held back), so the note stays waiting.
    await page.route('**/api/records/*/comments', (route) => route.abort('internetdisconnected'));
    await ctx.setOffline(false);
    await expect.poll(() => indicator().textContent()).toBe('1 change waiting to be sent');
    await page.locator('details[data-account-menu] summary').click();
    let asked = '';
    page.once('dialog', (d) => {
      asked = d.message();
      void d.dismiss();
    });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect.poll(() => asked).toContain('1 change is not sent yet; signing out deletes them');
    expect(new URL(page.url()).pathname).toBe('/records/demo-rec-2526-bms-cell-logging');
    await page.unroute('**/api/records/*/comments');
  });
});
