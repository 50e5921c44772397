// The password form on /account (issue 13, section 5): labelled fields and errors tied to each field.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launch();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 1000 } })).newPage();
  await signIn(page, 'alumni@wakebook.test');
});
afterAll(async () => {
  await browser?.close();
});

describe('changing the password on /account', () => {
  it('shows each problem beside its field and changes nothing', async () => {
    await page.goto(`${baseUrl()}/account`);
    const form = page.getByRole('form', { name: 'Change your password' });
    await form.getByLabel('Current password').fill('not my password at all');
    await form.getByLabel('New password', { exact: true }).fill('heron lantern copper tide');
    await form.getByLabel('New password again').fill('heron lantern copper tid');
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByText('The two new passwords differ').waitFor();
    await form.getByLabel('New password again').fill('heron lantern copper tide');
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByText('That is not your current password.').waitFor();
    expect(await form.getByLabel('Current password').getAttribute('aria-invalid')).toBe('true');
    expect(await form.getByLabel('Current password').getAttribute('aria-describedby')).toBe('pw-currentPassword-error');
    await shot(page, 'account-password-errors');
    // The old password still signs in.
    const again = await browser.newContext();
    const p2 = await again.newPage();
    await signIn(p2, 'alumni@wakebook.test');
    expect(new URL(p2.url()).pathname).toBe('/');
    await again.close();
  });
});
