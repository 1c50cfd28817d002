import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

interface VariantPage {
  rows: { label: string }[];
  total: number;
}

const labelLinks = (page: Page) => page.locator('.ag-row [col-id="label"] a');
/** The plain table of first rows the page draws before the grid's code has arrived. */
const firstRowsTable = (page: Page) => page.getByRole('table', { name: 'Variants' });

/** The rows the grid has rendered (it renders the visible ones and a few more), by row index. */
async function renderedRows(page: Page): Promise<Map<number, string>> {
  const rows = await page.locator('.ag-row[row-index]').evaluateAll((elements) =>
    elements.map((element) => [Number(element.getAttribute('row-index')), element.querySelector('[col-id="label"] a')?.textContent ?? null] as const),
  );
  return new Map(rows.filter((row): row is readonly [number, string] => row[1] !== null));
}

/**
 * Waits until the grid shows the expected variants: every rendered row holds the label the API puts at
 * its index, at least the first screenful is there, and no row beyond the expected ones.
 */
async function expectGridToShow(page: Page, expected: readonly string[]): Promise<void> {
  const screenful = Math.min(expected.length, 10);
  await expect
    .poll(
      async () => {
        // The count line says how many match; the rendered rows must be those, at their places.
        const rows = await renderedRows(page);
        const count = await matchCount(page);
        if (count !== expected.length) return `count ${count}`;
        const wrong = [...rows].filter(([index, label]) => expected[index] !== label);
        const firstRows = [...Array(screenful).keys()].every((index) => rows.has(index));
        return wrong.length === 0 && firstRows ? 'matches' : JSON.stringify({ wrong: wrong.slice(0, 3), rendered: rows.size });
      },
      { timeout: 10_000 },
    )
    .toBe('matches');
}

/** What the list API answers for the same query, as the reference for what the grid shows. */
async function apiLabels(page: Page, query: string): Promise<string[]> {
  const response = await page.request.get(`${baseUrl}/api/variants?${query}&pageSize=100`);
  expect(response.ok()).toBe(true);
  const body = (await response.json()) as VariantPage;
  expect(body.total).toBeLessThanOrEqual(100);
  return body.rows.map((row) => row.label);
}

/** The count above the grid, or null while it is loading. */
async function matchCount(page: Page): Promise<number | null> {
  const text = await page.getByText(/^(\d[\d,]* variants? match(es)?|Loading variants…)$/).textContent();
  return text?.startsWith('Loading') ? null : Number((text ?? '').replace(/[^\d]/g, ''));
}

/**
 * Milliseconds from the start of navigation to the first variant row on screen (in the first-rows table
 * or the grid, whichever comes first), and to the grid's own first row.
 */
async function timeToFirstRows(page: Page, url: string): Promise<{ firstRowsMs: number; gridRowsMs: number }> {
  const start = Date.now();
  await page.goto(url);
  await page.locator('main [role="row"] a[href^="/variants/"]').first().waitFor();
  const firstRowsMs = Date.now() - start;
  await labelLinks(page).first().waitFor();
  return { firstRowsMs, gridRowsMs: Date.now() - start };
}

describe.skipIf(!hasBrowser)('the registry', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  const browserErrors: string[] = [];

  beforeAll(async () => {
    browser = await openBrowser();
    context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    context.on('page', (opened) => opened.on('pageerror', (error) => browserErrors.push(error.message)));
    page = await context.newPage();
    page.on('console', (message) => {
      // AG Grid reports a missing module or a bad option as a console error; a 401 before sign-in is expected.
      if (message.type() === 'error' && !message.text().includes('401')) browserErrors.push(message.text());
    });
    await signInAs(page, 'lead@kcatalog.example');
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('shows the first rows of the registry, and reports how long they took', async () => {
    const { firstRowsMs, gridRowsMs } = await timeToFirstRows(page, `${baseUrl}/registry`);
    console.log(`registry: first rows ${firstRowsMs} ms after navigation, the grid's ${gridRowsMs} ms (demo data, ${await matchCount(page)} variants)`);
    await expectGridToShow(page, await apiLabels(page, 'sort=updated&order=desc'));
    await screenshot(page, 'registry-full');
  });

  it('draws the first rows while the grid is on its way, then hands them over to the grid', async () => {
    const query = 'campaignId=1&sort=ddg&order=asc';
    const expected = await apiLabels(page, query);
    const waiting = await context.newPage();
    let releaseGrid = () => {};
    const gridHeld = new Promise<void>((release) => (releaseGrid = release));
    await waiting.route(/\/assets\/variant-grid-[\w-]+\.js$/, async (route) => {
      await gridHeld;
      await route.continue();
    });
    await waiting.goto(`${baseUrl}/registry?${query}`);

    const table = firstRowsTable(waiting);
    await table.waitFor();
    const shownFirst = await table.locator('[role="row"] a[href^="/variants/"]').allTextContents();
    expect(shownFirst.length).toBeGreaterThanOrEqual(5);
    expect(shownFirst).toEqual(expected.slice(0, shownFirst.length));
    expect(await table.getByRole('columnheader').first().textContent()).toBe('Variant');
    await screenshot(waiting, 'registry-first-rows');

    releaseGrid();
    await labelLinks(waiting).first().waitFor();
    await expect.poll(() => table.count()).toBe(0);
    await expectGridToShow(waiting, expected);
    await waiting.close();
  });

  it('lets a lead filter by catalytic role and fold change, sort by ΔΔG‡, share the view by its link, and step back and forward', async () => {
    await page.goto(`${baseUrl}/registry`);
    await labelLinks(page).first().waitFor();

    await page.getByLabel('Catalytic role at a mutated site').selectOption('electrostatic');
    await page.waitForURL(/role=electrostatic/);
    const roleOnly = await apiLabels(page, 'role=electrostatic&sort=updated&order=desc');
    await expectGridToShow(page, roleOnly);

    await page.getByLabel('Fold change at least (×)').fill('1');
    await page.getByLabel('Fold change at least (×)').press('Enter');
    await page.waitForURL(/minFoldChange=1/);
    const filtered = await apiLabels(page, 'role=electrostatic&minFoldChange=1&sort=updated&order=desc');
    expect(filtered.length).toBeGreaterThan(1);
    await expectGridToShow(page, filtered);

    await page.locator('.ag-header-cell[col-id="ddg"] .ag-header-cell-label').click();
    await page.waitForURL(/sort=ddg&order=asc/);
    const sorted = await apiLabels(page, 'role=electrostatic&minFoldChange=1&sort=ddg&order=asc');
    expect(sorted).not.toEqual(filtered);
    await expectGridToShow(page, sorted);
    await expect.poll(() => page.locator('.ag-header-cell[col-id="ddg"]').getAttribute('aria-sort')).toBe('ascending');
    await screenshot(page, 'registry-filtered-sorted');

    // The address is the view: a new page opened on it shows the same rows in the same order and the same filters.
    const sharedUrl = page.url();
    const colleague = await context.newPage();
    const times = await timeToFirstRows(colleague, sharedUrl);
    console.log(`registry: first rows ${times.firstRowsMs} ms on a shared link, the grid's ${times.gridRowsMs} ms (${sorted.length} variants)`);
    await expectGridToShow(colleague, sorted);
    await expect.poll(() => colleague.getByLabel('Catalytic role at a mutated site').inputValue()).toBe('electrostatic');
    expect(await colleague.getByLabel('Fold change at least (×)').inputValue()).toBe('1');
    await expect.poll(() => colleague.locator('.ag-header-cell[col-id="ddg"]').getAttribute('aria-sort')).toBe('ascending');
    await colleague.close();

    // Back undoes the sort, then the fold-change filter; forward brings them back.
    await page.goBack();
    await page.waitForURL((url) => !url.search.includes('sort=ddg'));
    await expectGridToShow(page, filtered);
    // Back on the default order (newest change first), so ΔΔG‡ is no longer the sorted column.
    await expect.poll(() => page.locator('.ag-header-cell[col-id="ddg"]').getAttribute('aria-sort')).toBe('none');
    await page.goBack();
    await page.waitForURL((url) => !url.search.includes('minFoldChange'));
    await expectGridToShow(page, roleOnly);
    expect(await page.getByLabel('Fold change at least (×)').inputValue()).toBe('');
    await page.goForward();
    await page.goForward();
    await page.waitForURL(/sort=ddg&order=asc/);
    await expectGridToShow(page, sorted);
    expect(await page.getByLabel('Fold change at least (×)').inputValue()).toBe('1');
  }, 150_000);

  it('exports the filtered, sorted view as a CSV file with exactly the rows shown, in their order', async () => {
    const query = 'role=electrostatic&minFoldChange=1&sort=ddg&order=asc';
    await page.goto(`${baseUrl}/registry?${query}`);
    const expected = await apiLabels(page, query);
    await expectGridToShow(page, expected);
    const shown = await matchCount(page);
    expect(shown).toBe(expected.length);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^kcatalog-variants-\d{4}-\d{2}-\d{2}\.csv$/);
    const text = readFileSync(await download.path(), 'utf8');
    // One header line, then one line per variant (the demo's notes hold no line breaks); the file ends with a line break.
    const lines = text.replace(/^\ufeff/, '').split('\r\n').filter((line) => line !== '');
    expect(lines.length - 1).toBe(shown);
    const parsed = Papa.parse<Record<string, string>>(text.replace(/^\ufeff/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((row) => row.Mutations)).toEqual(expected);
    expect(parsed.data.every((row) => row['Catalytic roles'].split(', ').includes('electrostatic'))).toBe(true);
    await screenshot(page, 'registry-export');
  });

  it('lets a viewer export the view too', async () => {
    const viewerContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    try {
      const viewer = await viewerContext.newPage();
      await signInAs(viewer, 'viewer@kcatalog.example');
      await viewer.goto(`${baseUrl}/registry?role=electrostatic`);
      await labelLinks(viewer).first().waitFor();
      // A viewer may not register variants, but reading is all an export asks for.
      expect(await viewer.getByRole('link', { name: 'Register variant' }).count()).toBe(0);
      const [download] = await Promise.all([viewer.waitForEvent('download'), viewer.getByRole('link', { name: 'CSV' }).click()]);
      const parsed = Papa.parse<Record<string, string>>(readFileSync(await download.path(), 'utf8').replace(/^\ufeff/, ''), { header: true, skipEmptyLines: true });
      expect(parsed.data.map((row) => row.Mutations)).toEqual(await apiLabels(viewer, 'role=electrostatic&sort=updated&order=desc'));
      await screenshot(viewer, 'registry-viewer');
    } finally {
      await viewerContext.close();
    }
  });

  it('hides a column through the URL-backed column choice and shows ΔΔG‡ in kcal/mol on request', async () => {
    await page.goto(`${baseUrl}/registry?role=electrostatic&sort=ddg&order=asc`);
    await labelLinks(page).first().waitFor();
    await page.locator('summary', { hasText: 'Columns' }).click();
    // A click, not uncheck(): the box follows the address, which changes a moment after the click.
    await page.getByLabel('Positions').click();
    await page.waitForURL(/columns=/);
    await expect.poll(() => page.locator('.ag-header-cell[col-id="positions"]').count()).toBe(0);
    const withoutPositions = page.url();
    await page.keyboard.press('Escape');

    // The energy unit is a per-user preference, not part of the view: the same link shows either unit.
    await page.getByRole('button', { name: 'kcal/mol' }).click();
    await page.locator('.ag-header-cell[col-id="ddg"]', { hasText: 'kcal/mol' }).waitFor();
    const ddgKcal = await page.locator('.ag-row[row-index="0"] [col-id="ddg"]').textContent();
    await page.getByRole('button', { name: 'kJ/mol' }).click();
    await page.locator('.ag-header-cell[col-id="ddg"]', { hasText: 'kJ/mol' }).waitFor();
    const ddgKj = await page.locator('.ag-row[row-index="0"] [col-id="ddg"]').textContent();
    // 1 kcal = 4.184 kJ (thermochemical calorie, NIST SP 811).
    const central = (text: string | null) => Number((text ?? '').split('±')[0].replace('−', '-').trim());
    expect(central(ddgKj) / central(ddgKcal)).toBeCloseTo(4.184, 1);

    const other = await context.newPage();
    await other.goto(withoutPositions);
    await labelLinks(other).first().waitFor();
    expect(await other.locator('.ag-header-cell[col-id="positions"]').count()).toBe(0);
    expect(await other.locator('.ag-header-cell[col-id="ddg"]').count()).toBe(1);
    await other.close();
  });

  it('opens a variant from its row', async () => {
    await page.goto(`${baseUrl}/registry?sort=label&order=asc`);
    const first = labelLinks(page).first();
    const label = await first.textContent();
    await first.click();
    await page.waitForURL(/\/variants\/\d+$/);
    expect(label).toBeTruthy();
  });

  it('says so when nothing matches, and when the list cannot be loaded offers to try again', async () => {
    await page.goto(`${baseUrl}/registry?q=no-such-variant-anywhere`);
    await page.getByText('No variant matches these filters.').waitFor();
    expect(await page.getByLabel('Search').inputValue()).toBe('no-such-variant-anywhere');
    await screenshot(page, 'registry-empty');

    // The server is made to fail (and then to be slow) only for this page, to show the error and loading states.
    await page.route('**/api/variants?*', (route) => route.fulfill({ status: 500, contentType: 'application/json', body: '{"error":{"code":"internal","message":"Something failed on the server."}}' }));
    await page.goto(`${baseUrl}/registry?position=87`);
    await page.getByText('This could not be loaded.').waitFor();
    await screenshot(page, 'registry-error');
    await page.unroute('**/api/variants?*');
    await page.route('**/api/variants?*', async (route) => {
      await new Promise((done) => setTimeout(done, 1500));
      await route.continue();
    });
    await page.getByRole('button', { name: 'Try again' }).click();
    await page.getByText('Loading variants…').waitFor();
    await screenshot(page, 'registry-loading');
    await labelLinks(page).first().waitFor();

    // Opened while the list is slow, the page draws the table's head and placeholder rows at once.
    await page.goto(`${baseUrl}/registry?position=190`);
    await page.locator('[role="table"][aria-label="Variants"][aria-busy="true"]').waitFor();
    await page.getByText('Loading variants…').waitFor();
    await screenshot(page, 'registry-loading-first');
    await labelLinks(page).first().waitFor();
    await page.unroute('**/api/variants?*');
    await expectGridToShow(page, await apiLabels(page, 'position=190&sort=updated&order=desc'));
  });

  it('reports what it could not read in a link, and shows the rest', async () => {
    await page.goto(`${baseUrl}/registry?role=catalyst&residue=Tyr`);
    await page.getByText('Part of this link could not be read and was left out').waitFor();
    await labelLinks(page).first().waitFor();
    expect(await page.getByLabel('Residue (from or to)').inputValue()).toBe('Y');
    await expectGridToShow(page, await apiLabels(page, 'residue=Y&sort=updated&order=desc'));
  });

  it('logged no errors in the browser', () => {
    expect(browserErrors.filter((message) => !message.includes('500'))).toEqual([]);
  });
});
