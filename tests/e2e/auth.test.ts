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

const ROLES = [
  { role: 'lead', email: 'lead@wakebook.test', name: 'Maren Kowalczyk', admin: true },
  { role: 'advisor', email: 'advisor@wakebook.test', name: 'Dr. Felix Arnaud', admin: false },
  { role: 'member', email: 'member@wakebook.test', name: 'Jonas Lindqvist', admin: false },
  { role: 'alumni', email: 'alumni@wakebook.test', name: 'Priya Raman', admin: false },
];

describe('signing in and out', () => {
  for (const r of ROLES) {
    it(`${r.role}: signs in, sees the home page, signs out`, async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await context.newPage();
      await signIn(page, r.email);
      expect(new URL(page.url()).pathname).toBe('/');
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('Welcome back');
      await expect(page.getByText('Season 2025–26').first().isVisible()).resolves.toBe(true);
      const nav = page.getByRole('navigation', { name: 'Sections' });
      expect(await nav.getByRole('link', { name: 'Admin' }).count()).toBe(r.admin ? 1 : 0);
      await shot(page, `home-${r.role}`);
      await page.getByLabel(`Account menu for ${r.name}`).click();
      await Promise.all([page.waitForURL(/\/sign-in/), page.getByRole('button', { name: 'Sign out' }).click()]);
      await page.goto(`${baseUrl()}/`);
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      await context.close();
    });
  }

  it('shows a clear message for a wrong password and keeps the e-mail', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByLabel('E-mail').fill('member@wakebook.test');
    await page.getByLabel('Password').fill('not-my-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    expect(await page.getByRole('alert').textContent()).toContain('do not match');
    expect(await page.getByLabel('E-mail').inputValue()).toBe('member@wakebook.test');
    await shot(page, 'sign-in-wrong-password');
    await page.close();
  });

  it('shows field errors for an empty form', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Enter your e-mail address.').waitFor();
    expect(await page.getByLabel('E-mail').getAttribute('aria-invalid')).toBe('true');
    await page.close();
  });

  it('returns a signed-out visitor to the page they asked for', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/subsystems`);
    expect(page.url()).toContain('/sign-in?next=%2Fsubsystems');
    await page.getByLabel('E-mail').fill('alumni@wakebook.test');
    await page.getByLabel('Password').fill('wakebook-demo');
    await Promise.all([page.waitForURL(/\/subsystems$/), page.getByRole('button', { name: 'Sign in' }).click()]);
    await page.close();
  });

  it('signs in with the keyboard alone', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    // The e-mail field has focus on arrival (the browser applies autofocus at its next rendering step, which
    // can come just after the load event); Tab moves to the password; Enter submits.
    await page.waitForFunction(() => document.activeElement?.id === 'email', undefined, { timeout: 5000 });
    await page.keyboard.type('advisor@wakebook.test');
    await page.keyboard.press('Tab');
    await page.keyboard.type('wakebook-demo');
    await Promise.all([page.waitForURL((u) => u.pathname === '/'), page.keyboard.press('Enter')]);
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => document.activeElement?.textContent?.trim());
    expect(focused).toBe('Skip to content');
    await page.close();
  });

  it('phone width: the shell still fits and the sections stay reachable', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await signIn(page, 'member@wakebook.test');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    expect(
      await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Records' }).count(),
    ).toBe(1);
    await shot(page, 'home-member-phone');
    await context.close();
  });
});
