import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

// The demo campaign (invented) and some of its registered variants.
const campaignName = 'AmdT acid tolerance, round 2';
const variants = ['parent', 'Y87F', 'Y87H', 'Y87D'];
const rowCount = 3000;

/** A kineticist's sheet of fitted values: no campaign column, the date under "Day", an "Operator" column beside it. */
function measurementsCsv(): Buffer {
  const lines = ['Variant,Substrate,Temperature (°C),pH,Day,Operator,kcat (1/s),kcat SE (1/s),Km (mM),Km SE (mM)'];
  for (let index = 0; index < rowCount; index += 1) {
    const day = String(1 + (index % 28)).padStart(2, '0');
    const kcat = (4 + (index % 13) / 4).toFixed(2);
    const km = (0.5 + (index % 7) / 10).toFixed(2);
    lines.push(`${variants[index % variants.length]},4-nitroanilide,45,5.5,2027-02-${day},M. Halvorsen,${kcat},0.2,${km},0.05`);
  }
  return Buffer.from(`${lines.join('\n')}\n`, 'utf8');
}

describe.skipIf(!hasBrowser)('importing a spreadsheet in the browser', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('uploads, maps, shows the preview with an error, takes the fixed mapping, commits and shows the progress', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signInAs(page, 'kineticist@kcatalog.example');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Imports' }).click();
    await page.getByRole('heading', { name: 'Imports', exact: true }).waitFor();

    await page.getByLabel('The file holds').selectOption('measurements');
    await page.getByLabel('File (.xlsx or .csv)').setInputFiles({ name: 'kinetics-feb.csv', mimeType: 'text/csv', buffer: measurementsCsv() });
    await screenshot(page, 'imports-upload');
    await page.getByRole('button', { name: 'Upload' }).click();
    await page.getByRole('heading', { name: 'Map the columns' }).waitFor();

    // The headers gave most fields; the campaign is chosen for the whole file, and the date mapped by hand, wrongly.
    expect(await page.getByLabel('Column for Km', { exact: true }).inputValue()).toBe('8');
    expect(await page.getByLabel('Unit of Km', { exact: true }).inputValue()).toBe('mM');
    await page.getByLabel('Campaign of rows without one').selectOption({ label: campaignName });
    await page.getByLabel('Column for Assay date').selectOption({ label: 'F · Operator' });
    await screenshot(page, 'imports-mapping');
    await page.getByRole('button', { name: 'Check rows' }).click();
    const problems = page.getByRole('region', { name: 'Problems' });
    await problems.getByText(`${rowCount.toLocaleString('en-US')} problems`).waitFor({ timeout: 60_000 });
    await problems.getByText("must be a date written YYYY-MM-DD, got 'M. Halvorsen'").first().waitFor();
    expect(await page.getByRole('button', { name: /^Import 0 rows$/ }).isDisabled()).toBe(true);
    await screenshot(page, 'imports-preview-errors');

    // The fix: the date is in the column headed "Day".
    await page.getByLabel('Column for Assay date').selectOption({ label: 'E · Day' });
    await page.getByRole('button', { name: 'Check rows' }).click();
    const commitButton = page.getByRole('button', { name: `Import ${rowCount.toLocaleString('en-US')} rows` });
    await commitButton.waitFor({ timeout: 60_000 });
    expect(await problems.count()).toBe(0);
    const preview = page.getByRole('region', { name: 'Preview' });
    await preview.getByRole('columnheader', { name: 'kcat (s⁻¹)' }).waitFor();
    await preview.getByRole('cell', { name: 'Y87F' }).first().waitFor();
    await screenshot(page, 'imports-preview');

    await commitButton.click();
    const progress = page.getByRole('progressbar');
    await progress.first().waitFor();
    const seen: number[] = [];
    while (!(await page.getByText('Import finished').isVisible())) {
      const now = await progress.first().getAttribute('aria-valuenow');
      if (now !== null) seen.push(Number(now));
      if (seen.length === 3) await screenshot(page, 'imports-committing');
      await page.waitForTimeout(100);
    }
    expect(seen.length).toBeGreaterThan(0);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
    expect(await progress.first().getAttribute('aria-valuenow')).toBe(String(rowCount));
    expect(await progress.first().getAttribute('aria-valuemax')).toBe(String(rowCount));
    await page.getByText('3,000 rows written (3,000 new, 0 updated), 0 unchanged.').waitFor();
    await screenshot(page, 'imports-committed');

    // The job lives in the server: a reload finds it as it ended, and the history lists it.
    await page.reload();
    await page.getByText('Import finished').waitFor();
    await page.getByRole('link', { name: 'All imports' }).click();
    const history = page.getByRole('table', { name: 'Import history, newest first' });
    const row = history.getByRole('row').filter({ hasText: 'kinetics-feb.csv' });
    await row.getByText('Imported').waitFor();
    await row.getByText('3,000 new').waitFor();
    await screenshot(page, 'imports-history');
    await page.close();
  });

  it('does not offer imports to a viewer', async () => {
    const page = await browser.newPage();
    await signInAs(page, 'viewer@kcatalog.example');
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Imports' }).count()).toBe(0);
    await page.goto(`${baseUrl}/imports`);
    await page.getByText('This page is not available to your role.').waitFor();
    await page.close();
  });
});
