import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

const invitee = { email: 'e2e.invitee@kcatalog.example', name: 'Rosa Invented', password: 'rosa-invented-pass' };

// Tall enough that a full-page screenshot needs no resize: a resize makes Chromium repaint the sandboxed
// message frame (a separate renderer) and the screenshot would catch it blank.
const viewport = { width: 1400, height: 1800 };

/** A sandboxed frame paints a moment after its text is in the DOM; screenshots wait for the paint. */
async function framePainted(page: Page): Promise<void> {
  await page.waitForTimeout(600);
}

async function openOutbox(page: Page): Promise<void> {
  await page.goto(`${baseUrl}/admin/outbox`);
  await page.getByRole('heading', { name: 'Outbox' }).waitFor();
}

describe.skipIf(!hasBrowser)('mail in the browser', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('shows the empty Outbox and Digests pages', async () => {
    const page = await browser.newPage({ viewport });
    await signInAs(page, 'admin@kcatalog.example');
    await openOutbox(page);
    await page.getByText('No messages yet.').waitFor();
    await page.getByText(/goes to the app's own local mail server/).waitFor();
    await screenshot(page, 'outbox-empty');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Digests' }).click();
    await page.getByRole('heading', { name: 'Digests' }).waitFor();
    await page.getByRole('tab', { name: 'Past digests' }).click();
    await page.getByText('No digest has been sent for this campaign yet.').waitFor();
    await screenshot(page, 'digests-empty');
    await page.close();
  });

  it('lets an admin invite an address; the invitee follows the link from the Outbox, sets name and password and is signed in', async () => {
    const admin = await browser.newPage({ viewport });
    await signInAs(admin, 'admin@kcatalog.example');
    await admin.goto(`${baseUrl}/admin/users`);
    await admin.getByLabel('Address to invite').fill(invitee.email);
    await admin.getByLabel('Role to give').selectOption('kineticist');
    await admin.getByRole('button', { name: 'Send invitation' }).click();
    await admin.getByText(`Invitation sent to ${invitee.email}.`).waitFor();
    await admin.getByText(invitee.email, { exact: true }).waitFor();

    await openOutbox(admin);
    const subject = 'Ines Okafor-Lind invited you to Kcatalog';
    // The message travels over SMTP to the local fake server first; reload until it has arrived.
    for (let attempt = 0; attempt < 20 && !(await admin.getByRole('list', { name: 'Received messages' }).getByText(subject).count()); attempt += 1) {
      await admin.waitForTimeout(250);
      await admin.reload();
    }
    await admin.getByRole('list', { name: 'Received messages' }).getByText(subject).click();
    await admin.getByRole('article', { name: `Message: ${subject}` }).waitFor();
    await admin.frameLocator('iframe[title^="HTML part"]').getByText('Choose your name and password').waitFor();
    await framePainted(admin);
    await screenshot(admin, 'outbox-invitation');
    await admin.getByRole('tab', { name: 'Plain text' }).click();
    const text = (await admin.locator('article pre').textContent()) ?? '';
    const link = /https?:\/\/\S+\/invitation\?token=[A-Za-z0-9_-]{43}/.exec(text)?.[0];
    expect(link).toBeDefined();

    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await page.goto(link!);
    await page.getByRole('heading', { name: 'Join Kcatalog' }).waitFor();
    await page.getByText(invitee.email).waitFor();
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.getByText('must be at least 10 characters').waitFor();
    await screenshot(page, 'invitation-form-errors');
    await page.getByLabel('Your name').fill(invitee.name);
    await page.getByLabel('Password').fill(invitee.password);
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
    await page.getByText(invitee.name).first().waitFor();
    await screenshot(page, 'invitation-accepted');

    // The link works once.
    const again = await context.newPage();
    await again.goto(link!);
    await again.getByText('This invitation was already used.').waitFor();
    await context.close();
    await admin.close();
  });

  it('sends a digest now and shows it in the past runs and in the Outbox', async () => {
    const page = await browser.newPage({ viewport });
    await signInAs(page, 'lead@kcatalog.example');
    await page.goto(`${baseUrl}/digests`);
    await page.getByRole('heading', { name: 'Digests' }).waitFor();
    await page.frameLocator('iframe[title^="Digest:"]').getByText('ranked variants').first().waitFor();
    await framePainted(page);
    await screenshot(page, 'digests-preview');
    await page.getByRole('button', { name: 'Send now' }).click();
    await page.getByText(/Digest queued for 1 person/).waitFor();
    await page.getByRole('region', { name: 'Past digest' }).waitFor();
    await page.getByRole('region', { name: 'Past digest' }).getByText('lead@kcatalog.example').waitFor();
    await page.frameLocator('iframe[title^="Digest:"]').getByText('Rank movers').waitFor();
    await page.getByRole('region', { name: 'Past digest' }).getByText(/Sent$/).waitFor();
    await framePainted(page);
    await screenshot(page, 'digests-run');
    await page.getByRole('button', { name: '← All past digests' }).click();
    await page.getByRole('button', { name: /Open the digest of/ }).first().waitFor();
    await screenshot(page, 'digests-full');
    await page.close();

    const admin = await browser.newPage({ viewport });
    await signInAs(admin, 'admin@kcatalog.example');
    await openOutbox(admin);
    const digest = admin.getByRole('list', { name: 'Received messages' }).getByText(/^Weekly ranking:/);
    for (let attempt = 0; attempt < 20 && !(await digest.count()); attempt += 1) {
      await admin.waitForTimeout(250);
      await admin.reload();
    }
    await digest.first().click();
    await admin.frameLocator('iframe[title^="HTML part"]').getByText('Waiting for review').waitFor();
    await framePainted(admin);
    await screenshot(admin, 'outbox-full');
    await admin.getByRole('tab', { name: 'Send log' }).click();
    await admin.getByRole('list', { name: 'Send log' }).getByText('Sent').first().waitFor();
    await framePainted(admin);
    await screenshot(admin, 'outbox-send-log');
    await admin.close();
  });

  it('offers a password reset from the sign-in page that answers the same for any address', async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
    await page.getByLabel('E-mail address').fill('nobody-at-all@kcatalog.example');
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await page.getByText(/If an account exists for that address/).waitFor();
    await screenshot(page, 'forgot-password-sent');
    await page.close();
  });
});
