import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe('onboarding, seasons and handover', () => {
  it('a new member follows a route and ticks items; progress shows on the hub and the home page', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    await signIn(page, 'member@wakebook.test');
    await page.goto(`${baseUrl()}/subsystems/cooling`);
    const route = page
      .getByRole('region', { name: 'Onboarding route' })
      .or(page.locator('section[aria-labelledby="route-h"]'));
    await route.getByText(/of 5 done/).waitFor();
    const before = await route.getByText(/of 5 done/).textContent();
    await page.locator('[data-island][data-mounted] input[type="checkbox"]').first().waitFor({ state: 'attached' });
    const box = route.getByRole('checkbox', { name: /Done: / }).nth(1);
    // The tick shows at once and is saved in the background: wait for the save before reloading.
    const saved = page.waitForResponse(
      (r) => r.url().endsWith('/api/onboarding/cooling/progress') && r.request().method() === 'POST',
    );
    await box.check();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => route.getByText(/of 5 done/).textContent()).not.toBe(before);
    await page.reload();
    expect(
      await route
        .getByRole('checkbox', { name: /Done: / })
        .nth(1)
        .isChecked(),
    ).toBe(true);
    await page.goto(`${baseUrl()}/`);
    expect(await page.getByRole('progressbar', { name: /Cooling onboarding: 2 of 5/ }).count()).toBe(1);
    await shot(page, 'onboarding-member');
    await page.close();
  });

  it('an advisor reorders a route with the keyboard-friendly buttons and saves it', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    await signIn(page, 'advisor@wakebook.test');
    await page.goto(`${baseUrl()}/subsystems/hull`);
    await page.getByText('Arrange this route').click();
    const list = page.getByRole('list', { name: 'Route items in order' });
    await list.getByRole('listitem').first().waitFor();
    // The buttons answer once the island has hydrated (it is marked `data-mounted` then).
    await page.locator('[data-island][data-mounted]').getByRole('list', { name: 'Route items in order' }).waitFor();
    const title = (i: number) => list.getByRole('listitem').nth(i).locator('span.font-medium').textContent();
    const firstBefore = (await title(0))!;
    await list
      .getByRole('button', { name: /Move .* down/ })
      .first()
      .click();
    expect(await title(1)).toBe(firstBefore);
    await page.getByRole('button', { name: 'Save route' }).click();
    await page.getByText('Route saved.').waitFor();
    await page.reload();
    const checklist = page.locator('section[aria-labelledby="route-h"] ol').first();
    expect(await checklist.locator('li').nth(1).textContent()).toContain(firstBefore);
    await shot(page, 'onboarding-advisor-reordered');
    await page.close();
  });

  it('a lead opens a season, sees the rollover confirmation, and reads the handover report', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    await signIn(page, 'lead@wakebook.test');
    await page.goto(`${baseUrl()}/seasons`);
    await page.locator('[data-island][data-mounted] #season-name').waitFor({ state: 'attached' });
    await page.getByRole('button', { name: 'Open season' }).click();
    await page.getByText('Name the season').first().waitFor();
    await page.getByLabel('Name (e.g. 2026–27)').fill('2026–27');
    await page.getByLabel('Starts').fill('2026-12-19');
    await page.getByLabel('Ends').fill('2027-12-17');
    await page.getByLabel('Boat (optional)').fill('Tern 6');
    await Promise.all([page.waitForLoadState('load'), page.getByRole('button', { name: 'Open season' }).click()]);
    await page.getByRole('heading', { name: '2026–27', level: 2 }).waitFor();
    await page.locator('[data-island][data-mounted] #season-name').waitFor({ state: 'attached' });
    await page.getByRole('button', { name: 'Start the rollover…' }).click();
    await page.locator('#roll-target').waitFor();
    // Every member of the current season starts ticked as continuing; the lead unticks who leaves.
    expect(await page.getByLabel(/Jonas Lindqvist/).isChecked()).toBe(true);
    await page.getByLabel(/Hanna Voss/).uncheck();
    await page.getByRole('button', { name: 'Show exactly what will change' }).click();
    const preview = page.getByRole('region', { name: 'What will change' });
    await preview.waitFor();
    const text = (await preview.textContent()) ?? '';
    expect(text).toContain('Rolling over from 2025–26 to 2026–27');
    expect(text).toMatch(
      /Jonas Lindqvist continues as a member of 2026–27 and keeps (Propulsion and motor drive|Cooling)/,
    );
    expect(text).toMatch(/Hanna Voss becomes alumni/);
    expect(text).not.toMatch(/;|\bpropulsion\b/);
    await shot(page, 'season-rollover-preview');
    await preview.getByRole('button', { name: 'Cancel' }).click();
    await page.goto(`${baseUrl()}/handover`);
    await page.getByRole('heading', { name: /Season 2025–26: what the next cohort gets/ }).waitFor();
    expect(await page.getByRole('meter').count()).toBeGreaterThanOrEqual(8);
    await shot(page, 'handover-report');
    await page.close();
  });
});
