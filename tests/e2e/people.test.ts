import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser, Page } from 'playwright-core';
import { launch, baseUrl, shot, signIn } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const NEWCOMER = { email: 'noor.haddad@northmere.example', name: 'Noor Haddad', password: 'tern-five-rudder-bearing' };
const NEW_PASSWORD = 'winter-layup-checklist-9';

/** Islands ignore clicks until hydrated (they are then marked data-mounted). */
async function hydrated(page: Page, selector: string): Promise<void> {
  await page.locator(`[data-island][data-mounted] ${selector}`).first().waitFor({ state: 'attached' });
}

/** The link in the newest captured e-mail to an address, read from the outbox page as a lead would. */
async function linkFromOutbox(lead: Page, to: string, subject: RegExp): Promise<string> {
  await lead.goto(`${baseUrl()}/admin/outbox`);
  const message = lead.getByRole('article').filter({ hasText: to }).filter({ hasText: subject }).first();
  await message.waitFor();
  const details = message.locator('details').first();
  if ((await details.getAttribute('open')) === null) await message.getByText('Plain text').click();
  const text = await message.getByTestId('mail-text').textContent();
  const link = /https?:\/\/\S+/.exec(text ?? '')?.[0];
  if (!link) throw new Error(`no link in:\n${text}`);
  // The server has no PUBLIC_URL in the tests, so links carry the request origin: the test server itself.
  expect(link.startsWith(baseUrl())).toBe(true);
  return link;
}

describe('bringing a new member in', () => {
  let lead: Page;
  let inviteLink = '';

  beforeAll(async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    lead = await context.newPage();
    await signIn(lead, 'lead@wakebook.test');
  });

  it('a lead invites someone from the admin pages', async () => {
    await lead.goto(`${baseUrl()}/admin`);
    await lead.getByRole('main').getByRole('link', { name: 'Invitations' }).first().click();
    await lead.waitForURL(/\/admin\/invitations$/);
    await hydrated(lead, '#inv-email');
    await lead.getByLabel('E-mail').fill(NEWCOMER.email);
    await lead.getByLabel('Name').fill(NEWCOMER.name);
    await lead.getByLabel('Role').selectOption('member');
    await lead.getByLabel('Solar').check();
    await lead.getByRole('button', { name: 'Send the invitation' }).click();
    await lead
      .getByRole('status')
      .filter({ hasText: `${NEWCOMER.name} was invited as member` })
      .waitFor();
    await lead.getByRole('row').filter({ hasText: NEWCOMER.email }).filter({ hasText: 'Pending' }).waitFor();
    await shot(lead, 'admin-invitations');
    // A second attempt that fails clears the line about the first success.
    await lead.getByLabel('E-mail').fill(NEWCOMER.email);
    await lead.getByLabel('Name').fill(NEWCOMER.name);
    await lead.getByRole('button', { name: 'Send the invitation', exact: true }).click();
    await lead.getByRole('alert').first().waitFor();
    expect(await lead.getByRole('status').filter({ hasText: 'was invited' }).count()).toBe(0);
    inviteLink = await linkFromOutbox(lead, NEWCOMER.email, /invited you to Wakebook/);
    // The outbox shows the e-mail's links as links.
    const mailLink = lead.getByTestId('mail-text').first().getByRole('link').first();
    expect(await mailLink.getAttribute('href')).toBe(inviteLink);
    expect(new URL(inviteLink).pathname).toMatch(/^\/invite\/[A-Za-z0-9_-]{20,}$/);
    await lead.getByText('As the recipient sees it (HTML)').first().click();
    await lead.frameLocator('iframe').first().getByRole('link', { name: 'Accept the invitation' }).waitFor();
    await shot(lead, 'admin-outbox');
  });

  it('the new member accepts from the e-mail, with field errors first, and is signed in', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(inviteLink);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Join your team');
    expect(await page.getByLabel('Your name').inputValue()).toBe(NEWCOMER.name);
    await page.getByLabel('Choose a password').fill('short');
    await page.getByRole('button', { name: 'Join and sign in' }).click();
    await page.getByText('Use at least 12 characters').waitFor();
    expect(await page.getByLabel('Choose a password').getAttribute('aria-invalid')).toBe('true');
    await page.getByLabel('Choose a password').fill('qwerty123456');
    await page.getByRole('button', { name: 'Join and sign in' }).click();
    await page.getByText('list of common passwords').waitFor();
    await shot(page, 'invite-accept-errors');
    await page.getByLabel('Choose a password').fill(NEWCOMER.password);
    await Promise.all([
      page.waitForURL((u) => u.pathname === '/'),
      page.getByRole('button', { name: 'Join and sign in' }).click(),
    ]);
    await page.getByLabel(`Account menu for ${NEWCOMER.name}`).waitFor();
    // The first visit welcomes them and starts their onboarding, not "Welcome back".
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Welcome to Wakebook, Noor');
    const start = page.getByRole('link', { name: 'Start your onboarding' });
    expect(await start.getAttribute('href')).toBe('/subsystems/solar#route-h');
    await shot(page, 'welcome-first-visit');
    // Signing out and in again with the chosen password works.
    await page.getByLabel(`Account menu for ${NEWCOMER.name}`).click();
    await Promise.all([page.waitForURL(/\/sign-in/), page.getByRole('button', { name: 'Sign out' }).click()]);
    await signIn(page, NEWCOMER.email, NEWCOMER.password);
    expect(new URL(page.url()).pathname).toBe('/');
    await context.close();
  });

  it('the used link then shows a clear page instead of the form', async () => {
    const page = await browser.newPage();
    const res = await page.goto(inviteLink);
    expect(res?.status()).toBe(410);
    expect(await page.getByRole('alert').textContent()).toContain('already been used');
    expect(await page.getByRole('button', { name: 'Join and sign in' }).count()).toBe(0);
    await shot(page, 'invite-used');
    await page.close();
  });

  it('the lead sees the new member on the people admin page and can assign a subsystem', async () => {
    await lead.goto(`${baseUrl()}/admin/people?q=haddad`);
    const row = lead.getByRole('row').filter({ hasText: NEWCOMER.email });
    await row.waitFor();
    await row.scrollIntoViewIfNeeded();
    await hydrated(lead, `button[aria-label="Change ${NEWCOMER.name}"]`);
    expect(await row.textContent()).toContain('Solar');
    await row.getByRole('button', { name: `Change ${NEWCOMER.name}` }).click();
    await row.getByLabel('Telemetry').check();
    await row.getByRole('button', { name: 'Save' }).click();
    await row.getByText('Saved.').waitFor();
    await lead.reload();
    expect(await lead.getByRole('row').filter({ hasText: NEWCOMER.email }).textContent()).toMatch(
      /Solar array, Telemetry/,
    );
    await shot(lead, 'admin-people');
  });

  it('a forgotten password is reset from the captured e-mail', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.waitForURL(/\/forgot-password$/);
    await page.getByLabel('E-mail').fill(NEWCOMER.email);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByRole('status').filter({ hasText: 'is on its way' }).waitFor();

    const resetLink = await linkFromOutbox(lead, NEWCOMER.email, /Reset your Wakebook password/);
    expect(new URL(resetLink).pathname).toMatch(/^\/reset\/[A-Za-z0-9_-]{20,}$/);
    await page.goto(resetLink);
    await page.getByLabel('New password').fill(NEW_PASSWORD);
    await Promise.all([
      page.waitForURL(/\/sign-in\?reset=1$/),
      page.getByRole('button', { name: 'Set the new password' }).click(),
    ]);
    await page.getByRole('status').filter({ hasText: 'Your password was changed' }).waitFor();
    await shot(page, 'sign-in-after-reset');
    await signIn(page, NEWCOMER.email, NEW_PASSWORD);
    expect(new URL(page.url()).pathname).toBe('/');
    // The link works once.
    await page.goto(resetLink);
    expect(await page.getByRole('alert').textContent()).toContain('already been used');
    await context.close();
  });

  it('the lead downloads the handover bundle and sees the bytes arrive', async () => {
    await lead.goto(`${baseUrl()}/admin/export`);
    await hydrated(lead, 'button');
    const [download] = await Promise.all([
      lead.waitForEvent('download'),
      lead.getByRole('button', { name: 'Download the handover bundle' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^wakebook-handover-\d{4}-\d{2}-\d{2}\.zip$/);
    await lead
      .getByText(/^Done: .* saved\.$/)
      .first()
      .waitFor();
    await shot(lead, 'admin-export');
  });

  it('the audit log lists the invitation, filtered by action', async () => {
    await lead.goto(`${baseUrl()}/admin/audit`);
    await lead.getByLabel('What').selectOption('invitation.');
    await Promise.all([lead.waitForURL(/action=invitation/), lead.getByRole('button', { name: 'Filter' }).click()]);
    const text = await lead.getByRole('table').textContent();
    // Actions in words, targets as linked names, never dotted codes.
    expect(text).toContain('invited');
    expect(text).toContain('accepted the invitation and joined as');
    expect(text).not.toContain('invitation.create');
    expect(text).not.toContain('signed in');
    expect(
      await lead
        .getByRole('table')
        .getByRole('link', { name: new RegExp(NEWCOMER.name) })
        .count(),
    ).toBeGreaterThan(0);
    await shot(lead, 'admin-audit');
  });
});

describe('pages for others', () => {
  it('a member gets a 403 page on the admin pages and keeps the people directory', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'member@wakebook.test');
    for (const path of [
      '/admin',
      '/admin/people',
      '/admin/invitations',
      '/admin/outbox',
      '/admin/audit',
      '/admin/export',
    ]) {
      const res = await page.goto(`${baseUrl()}${path}`);
      expect(res?.status(), path).toBe(403);
      expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Only leads may open');
    }
    const res = await page.goto(`${baseUrl()}/people`);
    expect(res?.status()).toBe(200);
    await page.goto(`${baseUrl()}/account`);
    await hydrated(page, 'input[type="checkbox"]');
    await page.getByLabel('Send me the weekly digest by e-mail').check();
    await page.getByText('You will get the weekly digest.').waitFor();
    await context.close();
  });

  it('signed-out pages stay reachable without a session', async () => {
    const page = await browser.newPage();
    for (const path of [
      '/forgot-password',
      '/invite/AAAAAAAAAAAAAAAAAAAAAAAAAAA',
      '/reset/AAAAAAAAAAAAAAAAAAAAAAAAAAA',
    ]) {
      await page.goto(`${baseUrl()}${path}`);
      expect(new URL(page.url()).pathname, path).toBe(path);
    }
    expect(await page.getByRole('alert').textContent()).toContain('not valid');
    await page.close();
  });
});

describe('accessibility of the people, mail and admin pages', () => {
  const AXE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
  const PAGES: { path: string; as: string | null }[] = [
    { path: '/admin', as: 'lead' },
    { path: '/admin/people', as: 'lead' },
    { path: '/admin/invitations', as: 'lead' },
    { path: '/admin/outbox', as: 'lead' },
    { path: '/admin/audit', as: 'lead' },
    { path: '/admin/export', as: 'lead' },
    { path: '/admin/digest', as: 'lead' },
    { path: '/admin/people', as: 'member' },
    { path: '/account', as: 'member' },
    { path: '/forgot-password', as: null },
    { path: '/invite/AAAAAAAAAAAAAAAAAAAAAAAAAAA', as: null },
    { path: '/reset/AAAAAAAAAAAAAAAAAAAAAAAAAAA', as: null },
  ];
  const signedIn = new Map<string, Page>();
  async function pageFor(as: string | null): Promise<Page> {
    const key = as ?? 'anonymous';
    if (!signedIn.has(key)) {
      const p = await browser.newPage({ viewport: { width: 1280, height: 900 } });
      if (as) await signIn(p, `${as}@wakebook.test`);
      signedIn.set(key, p);
    }
    return signedIn.get(key)!;
  }
  for (const { path, as } of PAGES) {
    it(`${path} as ${as ?? 'nobody'} has no serious or critical axe violations`, async () => {
      const page = await pageFor(as);
      await page.goto(`${baseUrl()}${path}`, { waitUntil: 'networkidle' });
      await page.evaluate(AXE);
      const violations = (await page.evaluate(async () => {
        // @ts-expect-error injected above
        const r = await window.axe.run(document, { resultTypes: ['violations'] });
        return r.violations.map((v: { id: string; impact: string; nodes: { target: string[] }[] }) => ({
          id: v.id,
          impact: v.impact,
          targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')),
        }));
      })) as { id: string; impact: string; targets: string[] }[];
      const bad = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
      expect(bad, JSON.stringify(bad, null, 2)).toEqual([]);
    });
  }
});
