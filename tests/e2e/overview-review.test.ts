import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MeasurementDto } from '@shared/schemas/measurement';
import type { OverviewDto } from '@shared/schemas/overview';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

async function getJson<T>(page: Page, path: string): Promise<T> {
  const response = await page.request.get(`${baseUrl}${path}`);
  expect(response.ok()).toBe(true);
  return (await response.json()) as T;
}

const submitted = (page: Page) =>
  getJson<{ items: MeasurementDto[]; total: number }>(page, '/api/measurements?reviewState=submitted&pageSize=100');

describe.skipIf(!hasBrowser)('the Overview and Review pages', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('shows a lead each campaign’s counts, best variants in ΔΔG‡ order, the review queue and recent activity', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    await page.goto(`${baseUrl}/`);
    const overview = await getJson<OverviewDto>(page, '/api/overview');
    const [first] = overview.campaigns;
    const card = page.getByRole('region', { name: first.campaign.name });
    await card.waitFor();

    const bestLabels = await card.getByRole('table').getByRole('link').allTextContents();
    expect(bestLabels).toEqual(first.bestVariants.map((variant) => variant.label));
    const ddgs = first.bestVariants.map((variant) => variant.ddg!.value);
    expect(ddgs).toEqual([...ddgs].sort((a, b) => a - b));
    await card.getByText(`${first.campaign.variantCounts.characterized}`, { exact: true }).first().waitFor();
    await card.getByText(`${first.awaitingReview} submitted measurements`).waitFor();
    await card.getByRole('link', { name: 'Review them →' }).waitFor();
    expect(await card.getByRole('heading', { name: 'Recent activity' }).count()).toBe(1);
    expect(await card.locator('ol li time').count()).toBe(first.recentActivity.length);
    await screenshot(page, 'overview-lead');

    await page.getByRole('button', { name: 'kcal/mol' }).click();
    await card.getByRole('columnheader', { name: 'ΔΔG‡ ± SE (kcal/mol)' }).waitFor();
    await page.getByRole('button', { name: 'kJ/mol' }).click();
    await card.getByRole('columnheader', { name: 'ΔΔG‡ ± SE (kJ/mol)' }).waitFor();
    await page.close();
  });

  it('shows the Overview loading and then failing with a way to try again', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    // Only for this page the server is made slow, then failing, to show those states.
    await page.route('**/api/overview', async (route) => {
      await new Promise((done) => setTimeout(done, 1500));
      await route.fulfill({ status: 503, contentType: 'application/json', body: '{"error":{"code":"unavailable","message":"The server is busy."}}' });
    });
    await page.goto(`${baseUrl}/`);
    await page.getByText('Loading the campaigns…').waitFor();
    await screenshot(page, 'overview-loading');
    await page.getByText('The server is busy.').waitFor({ timeout: 15_000 });
    await screenshot(page, 'overview-error');
    await page.unroute('**/api/overview');
    await page.getByRole('button', { name: 'Try again' }).click();
    await page.getByRole('heading', { name: 'Recent activity' }).first().waitFor();
    await page.close();
  });

  it('shows the Review list loading, then failing with a way to try again', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    await page.route('**/api/measurements?*', async (route) => {
      await new Promise((done) => setTimeout(done, 1500));
      await route.fulfill({ status: 503, contentType: 'application/json', body: '{"error":{"code":"unavailable","message":"The server is busy."}}' });
    });
    await page.goto(`${baseUrl}/review`);
    await page.getByText('Loading submitted measurements…').waitFor();
    await screenshot(page, 'review-loading');
    await page.getByText('The server is busy.').waitFor({ timeout: 15_000 });
    await screenshot(page, 'review-error');
    await page.unroute('**/api/measurements?*');
    await page.getByRole('button', { name: 'Try again' }).click();
    await page.getByText(/submitted measurements?, newest first/).waitFor();
    await page.close();
  });

  it('lets a lead approve a submitted measurement, which then leaves the list', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    const before = await submitted(page);
    // The oldest one, so that other journeys on the demo data keep the newer ones.
    const target = before.items.filter((measurement) => measurement.supersededById === null).at(-1)!;

    await page.goto(`${baseUrl}/review`);
    await page.getByText(`${before.total} submitted measurements, newest first`).waitFor();
    expect(await page.locator('tbody tr').count()).toBe(before.items.length);
    await screenshot(page, 'review-full');

    const checkbox = page.getByLabel(`Select measurement ${target.id} of ${target.variant.label}`);
    await checkbox.check();
    await page.getByText('1 measurement selected').waitFor();
    await page.getByRole('button', { name: 'Approve 1 measurement' }).click();
    await page.getByText('Approved 1 measurement').waitFor();
    await checkbox.waitFor({ state: 'detached' });
    await page.getByText(`${before.total - 1} submitted measurements, newest first`).waitFor();
    await screenshot(page, 'review-approved');

    const { measurement } = await getJson<{ measurement: MeasurementDto }>(page, `/api/measurements/${target.id}`);
    expect(measurement.reviewState).toBe('approved');
    expect(measurement.version).toBe(target.version + 1);
    await page.close();
  });

  it('asks for a reason before flagging, then flags in bulk', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    const before = await submitted(page);
    const targets = before.items.filter((measurement) => measurement.supersededById === null).slice(-2);

    await page.goto(`${baseUrl}/review`);
    for (const target of targets) await page.getByLabel(`Select measurement ${target.id} of ${target.variant.label}`).check();
    await page.getByRole('button', { name: 'Flag 2 measurements' }).click();
    await page.getByText('Reason is required to flag a measurement').waitFor();
    await screenshot(page, 'review-flag-needs-reason');
    await page.getByLabel(/^Reason/).fill('Enzyme stock of that week failed its activity check.');
    await page.getByRole('button', { name: 'Flag 2 measurements' }).click();
    await page.getByText('Flagged 2 measurements').waitFor();

    const after = await submitted(page);
    expect(after.total).toBe(before.total - 2);
    for (const target of targets) {
      const { measurement } = await getJson<{ measurement: MeasurementDto }>(page, `/api/measurements/${target.id}`);
      expect(measurement).toMatchObject({ reviewState: 'flagged', reviewReason: 'Enzyme stock of that week failed its activity check.' });
    }
    await page.close();
  });

  it('explains a conflict when someone else reviewed a measurement first, and reloads the list', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'lead@kcatalog.example');
    const before = await submitted(page);
    const target = before.items.filter((measurement) => measurement.supersededById === null).at(-1)!;
    await page.goto(`${baseUrl}/review`);
    await page.getByLabel(`Select measurement ${target.id} of ${target.variant.label}`).check();

    // Another lead approves it in the meantime, through the API with the same session.
    const csrf = (await getJson<{ csrfToken: string }>(page, '/api/auth/csrf')).csrfToken;
    const approval = await page.request.post(`${baseUrl}/api/measurements/${target.id}/review`, {
      headers: { 'X-CSRF-Token': csrf },
      data: { version: target.version, action: 'approve' },
    });
    expect(approval.status()).toBe(200);

    await page.getByRole('button', { name: 'Approve 1 measurement' }).click();
    await page.getByText('Someone changed one of these measurements first').waitFor();
    await screenshot(page, 'review-conflict');
    await page.getByRole('button', { name: 'Reload the list' }).click();
    await page.getByLabel(`Select measurement ${target.id} of ${target.variant.label}`).waitFor({ state: 'detached' });
    await page.close();
  });

  it('shows a viewer no edit controls, and the server refuses a forced review', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, 'viewer@kcatalog.example');
    const nav = await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents();
    expect(nav).toContain('Overview');
    expect(nav).toContain('Registry');
    expect(nav).not.toContain('Review');

    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { name: 'Recent activity' }).first().waitFor();
    expect(await page.getByRole('link', { name: 'Review them →' }).count()).toBe(0);
    await screenshot(page, 'overview-viewer');

    await page.goto(`${baseUrl}/registry`);
    await page.locator('.ag-row [col-id="label"] a').first().waitFor();
    expect(await page.getByRole('link', { name: 'Register variant' }).count()).toBe(0);
    await screenshot(page, 'registry-viewer');

    await page.goto(`${baseUrl}/review`);
    await page.getByText('This page is not available to your role.').waitFor();
    expect(await page.getByRole('button', { name: /Approve|Flag/ }).count()).toBe(0);
    await screenshot(page, 'review-viewer');

    const queue = await submitted(page);
    const target = queue.items[0];
    const forced = await page.evaluate(
      async ({ id, version }) => {
        const { csrfToken } = (await (await fetch('/api/auth/csrf')).json()) as { csrfToken: string };
        const response = await fetch('/api/measurements/review', {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken },
          body: JSON.stringify({ items: [{ id, version }], action: 'approve' }),
        });
        return { status: response.status, body: (await response.json()) as { error: { code: string } } };
      },
      { id: target.id, version: target.version },
    );
    expect(forced.status).toBe(403);
    expect(forced.body.error.code).toBe('forbidden');
    const { measurement } = await getJson<{ measurement: MeasurementDto }>(page, `/api/measurements/${target.id}`);
    expect(measurement.reviewState).toBe('submitted');
    await page.close();
  });
});
