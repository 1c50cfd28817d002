import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

// The navigation each role should see; the permission table in shared/auth decides it.
// About and the password page are in the account menu, for every role.
const expectedNavigation: Record<string, string[]> = {
  admin: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Review', 'Digests', 'Outbox', 'Admin'],
  lead: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Review', 'Digests'],
  kineticist: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Digests'],
  biologist: ['Overview', 'Registry', 'Landscape', 'Enzymes', 'Imports', 'Digests'],
  viewer: ['Overview', 'Registry', 'Landscape', 'Enzymes', 'Digests'],
};

/** Where a screenshot of part of a page goes, beside the full-page ones (tests/e2e/screenshots, kept out of git). */
function screenshotPath(name: string): string {
  const directory = resolve(import.meta.dirname, 'screenshots');
  mkdirSync(directory, { recursive: true });
  return resolve(directory, `${name}.png`);
}

/** The vertical centres (rounded to the pixel) of the top bar's visible links and buttons, distinct and sorted. */
async function headerRowTops(page: Page): Promise<number[]> {
  const tops = await page.locator('header').first().locator('a, button').evaluateAll((elements) =>
    elements
      .map((element) => element.getBoundingClientRect())
      .filter((box) => box.width > 0)
      .map((box) => Math.round(box.top + box.height / 2)),
  );
  return [...new Set(tops)].sort((a, b) => a - b);
}

describe.skipIf(!hasBrowser)('signing in and out in the browser', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('shows the sign-in page with the demo accounts, and a message for a wrong password', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByText('Demo accounts').waitFor();
    await screenshot(page, 'sign-in');
    await page.getByLabel('E-mail address').fill('lead@kcatalog.example');
    await page.getByLabel('Password').fill('wrong-password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByText('The e-mail address or password is not correct.').waitFor();
    await screenshot(page, 'sign-in-error');
    await page.close();
  });

  it.each(Object.keys(expectedNavigation))('signs in as %s, sees the right navigation and signs out', async (role) => {
    const page = await browser.newPage();
    await signInAs(page, `${role}@kcatalog.example`);
    const links = await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents();
    expect(links).toEqual(expectedNavigation[role]);
    await screenshot(page, `signed-in-${role}`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });

  it.each(['admin', 'lead', 'viewer'])('fits the top bar of a %s on one line at 1440 and 1280 px, and wraps it tidily below', async (role) => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, `${role}@kcatalog.example`);
    await page.goto(`${baseUrl}/registry`);
    // The top bar appears once the session is read; the page's own header comes after it.
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
    for (const width of [1440, 1280]) {
      await page.setViewportSize({ width, height: 900 });
      // Centres within a few pixels of each other: items of one line differ only in their own heights.
      const tops = await headerRowTops(page);
      expect(tops[tops.length - 1] - tops[0], `${role} at ${width} px: ${tops.join(', ')}`).toBeLessThanOrEqual(4);
      await page.locator('header').first().screenshot({ path: screenshotPath(`top-bar-${role}-${width}`) });
    }
    // Narrower, the pages take a second line of their own; the name and account stay beside the brand.
    await page.setViewportSize({ width: 1024, height: 900 });
    const navTop = await page.getByRole('navigation', { name: 'Main' }).evaluate((element) => element.getBoundingClientRect().top);
    const brandBottom = await page.locator('header a').first().evaluate((element) => element.getBoundingClientRect().bottom);
    expect(navTop).toBeGreaterThanOrEqual(brandBottom);
    await page.locator('header').first().screenshot({ path: screenshotPath(`top-bar-${role}-1024`) });
    await page.close();
  });

  it('opens the account menu from the keyboard, with the password page and About, and closes it with Escape', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    const account = page.getByRole('button', { name: /^Account:/ });
    expect(await account.getAttribute('aria-expanded')).toBe('false');
    expect(await page.getByRole('link', { name: 'Change password' }).count()).toBe(0);
    await account.focus();
    await page.keyboard.press('Enter');
    expect(await account.getAttribute('aria-expanded')).toBe('true');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Change password');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('About Kcatalog');
    await screenshot(page, 'account-menu-open');
    await page.keyboard.press('Escape');
    expect(await account.getAttribute('aria-expanded')).toBe('false');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-expanded'))).toBe('false');

    await page.keyboard.press('Enter');
    await page.getByRole('link', { name: 'Change password' }).click();
    await page.waitForURL(/\/account\/password$/);
    expect(await account.getAttribute('aria-expanded')).toBe('false');
    await page.getByRole('contentinfo').getByRole('link', { name: 'About Kcatalog' }).click();
    await page.getByRole('heading', { name: 'About Kcatalog' }).waitFor();
    await page.close();
  });

  it('sends a signed-out visitor to sign-in and back to the page they asked for', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl}/admin/users`);
    await page.waitForURL(/\/sign-in\?next=%2Fadmin%2Fusers/);
    await page.getByLabel('E-mail address').fill('admin@kcatalog.example');
    await page.getByLabel('Password').fill('kcatalog-demo');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/admin\/users$/);
    await page.getByRole('heading', { name: 'Users and roles' }).waitFor();
    await page.getByText('viewer@kcatalog.example').waitFor();
    await screenshot(page, 'admin-users');
    await page.close();
  });

  it('lets an admin add a user, with field messages for bad input first', async () => {
    const page = await browser.newPage();
    await signInAs(page, 'admin@kcatalog.example');
    await page.goto(`${baseUrl}/admin/users`);
    await page.getByRole('button', { name: 'Add user' }).click();
    await page.getByText('must be at least 10 characters').waitFor();
    await screenshot(page, 'admin-users-errors');
    await page.getByLabel('Name').fill('Pat Example');
    await page.getByLabel('E-mail address').fill('pat@kcatalog.example');
    await page.getByLabel('Role', { exact: true }).selectOption('kineticist');
    await page.getByLabel('Initial password').fill('pat-initial-password');
    await page.getByRole('button', { name: 'Add user' }).click();
    await page.getByText('Pat Example can now sign in.').waitFor();
    await page.getByText('pat@kcatalog.example').waitFor();
    await page.close();
  });

  it('shows a viewer that the admin page is not theirs', async () => {
    const page = await browser.newPage();
    await signInAs(page, 'viewer@kcatalog.example');
    await page.goto(`${baseUrl}/admin/users`);
    await page.getByText('This page is not available to your role.').waitFor();
    await screenshot(page, 'viewer-refused');
    await page.close();
  });
});
