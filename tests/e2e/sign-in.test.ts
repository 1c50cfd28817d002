import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

// The navigation each role should see; the permission table in shared/auth decides it.
const expectedNavigation: Record<string, string[]> = {
  admin: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Review', 'Digests', 'Outbox', 'Admin', 'About'],
  lead: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Review', 'Digests', 'About'],
  kineticist: ['Overview', 'Registry', 'Landscape', 'Assay entry', 'Enzymes', 'Imports', 'Digests', 'About'],
  biologist: ['Overview', 'Registry', 'Landscape', 'Enzymes', 'Imports', 'Digests', 'About'],
  viewer: ['Overview', 'Registry', 'Landscape', 'Enzymes', 'Digests', 'About'],
};

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
