/// <reference lib="dom" />
// page.evaluate callbacks run in the browser.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitAssay } from '@shared/assay/fit-assay';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

// The demo campaign is invented (server/seed/demo-scenario.ts). The rates are the Puromycin data, treated
// cells (Treloar 1974; Bates & Watts, Nonlinear Regression Analysis and Its Applications, 1988), read as mM
// and µM/min, six concentrations with two replicates each. R's nls gives Vm = 212.6837431425 µM/min and
// K = 0.06412128168 mM, so with [E]t = 10 nM kcat = Vm/[E]t = 212.68…/0.01 min⁻¹ = 354.4729 s⁻¹.
const demoCampaign = 'AmdT acid tolerance, round 2';
const S_MM = [0.02, 0.06, 0.11, 0.22, 0.56, 1.1];
const V_REPLICATES = [
  [76, 47],
  [97, 107],
  [123, 139],
  [159, 152],
  [191, 201],
  [207, 200],
];
const rateBlock = ['[S] (mM)\tv0 (µM/min)\tv0 (µM/min)', ...S_MM.map((s, row) => `${s}\t${V_REPLICATES[row][0]}\t${V_REPLICATES[row][1]}`)].join('\n');
const REFERENCE_KCAT_PER_SECOND = 212.6837431425 / 0.01 / 60;
const REFERENCE_KM_MOLAR = 0.06412128168e-3;

// A noise-free bell-shaped profile with pKa1 = 4.2, pKa2 = 8.4 (the fitPhProfile documentation example,
// scaled to 1500 M⁻¹ s⁻¹): the fit must return the pKa values it was built from, and the optimum
// (pKa1 + pKa2)/2 = 6.30 (Dixon, Biochem. J. 55 (1953) 161).
const phValues = Array.from({ length: 15 }, (_, index) => 3 + index / 2);
const phBlock = ['pH\tkcat/Km (M-1 s-1)', ...phValues.map((ph) => `${ph}\t${(1500 / (1 + 10 ** (4.2 - ph) + 10 ** (ph - 8.4))).toFixed(4)}`)].join('\n');

const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

/** Puts text on the clipboard of an element's paste event, as Ctrl+V from a spreadsheet does. */
async function paste(page: Page, label: string, text: string): Promise<void> {
  await page.getByLabel(label, { exact: true }).evaluate((element, clipboard) => {
    const data = new DataTransfer();
    data.setData('text/plain', clipboard);
    element.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
  }, text);
}

/** Collects Content-Security-Policy violations the page reports. */
async function watchCsp(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const violations: string[] = [];
    (window as unknown as { cspViolations: string[] }).cspViolations = violations;
    document.addEventListener('securitypolicyviolation', (event) => violations.push(`${event.violatedDirective}: ${event.blockedURI}`));
  });
}
const cspViolations = (page: Page) => page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);

async function parameterValue(page: Page, name: string): Promise<number> {
  return Number(await page.locator(`td[data-parameter="${name}"]`).getAttribute('data-value'));
}

describe.skipIf(!hasBrowser)('assay and pH profile entry in the browser', () => {
  let browser: Browser;
  let variant: { id: number; label: string };

  beforeAll(async () => {
    browser = await openBrowser();
    // A variant of our own, so the saved assay changes nothing other tests read.
    const page = await browser.newPage();
    await signInAs(page, 'biologist@kcatalog.example');
    const campaigns = (await (await page.request.get(`${baseUrl}/api/campaigns`)).json()) as { rows: { id: number; name: string; enzymeId: number }[] };
    const campaign = campaigns.rows.find((row) => row.name === demoCampaign)!;
    const enzyme = (await (await page.request.get(`${baseUrl}/api/enzymes/${campaign.enzymeId}`)).json()) as { sequence: string };
    const position = 250;
    const from = enzyme.sequence[position - 1];
    const to = from === 'G' ? 'A' : 'G';
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/csrf`)).json()) as { csrfToken: string };
    const created = await page.request.post(`${baseUrl}/api/variants`, {
      headers: { 'X-CSRF-Token': csrf.csrfToken },
      data: { campaignId: campaign.id, mutations: `${from}${position}${to}`, status: 'purified' },
    });
    expect(created.status()).toBe(201);
    const body = (await created.json()) as { id: number; label: string };
    variant = { id: body.id, label: body.label };
    await page.close();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('fits pasted rates live, excludes an outlier with a reason, saves, and stores what the preview showed', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1100 } });
    await watchCsp(page);
    await signInAs(page, 'kineticist@kcatalog.example');
    const response = await page.goto(`${baseUrl}/assays/new`);
    // The policy the charts run under: scripts from our origin only, no eval.
    const policy = response!.headers()['content-security-policy'];
    expect(policy).toMatch(/script-src 'self'/);
    expect(policy).not.toContain('unsafe-eval');
    await page.getByRole('heading', { name: 'Assay entry' }).waitFor();
    await screenshot(page, 'assay-entry-empty');

    await page.getByRole('combobox', { name: 'Campaign' }).selectOption({ label: demoCampaign });
    await page.getByRole('textbox', { name: 'Find a variant' }).fill(variant.label);
    const variantSelect = page.getByRole('combobox', { name: 'Variant', exact: true });
    await variantSelect.locator(`option[value="${variant.id}"]`).waitFor({ state: 'attached' });
    await variantSelect.selectOption(String(variant.id));
    await page.getByRole('textbox', { name: 'Substrate', exact: true }).fill('N-butanoyl-4-nitroaniline');
    await page.getByRole('textbox', { name: 'Temperature (°C)' }).fill('45');
    await page.getByRole('textbox', { name: 'pH', exact: true }).fill('5.5');
    await page.getByRole('textbox', { name: 'Buffer', exact: true }).fill('MES');
    await page.getByRole('textbox', { name: 'Buffer (mM)' }).fill('50');
    await page.getByRole('textbox', { name: 'Metal salt', exact: true }).fill('ZnCl2');
    await page.getByRole('textbox', { name: 'Metal salt concentration' }).fill('10');
    await page.getByRole('textbox', { name: 'Enzyme [E]t' }).fill('10');
    await page.getByRole('combobox', { name: '[E]t unit' }).selectOption('nM');
    await page.getByRole('textbox', { name: 'Detection' }).fill('absorbance 405 nm');

    await paste(page, 'Paste a block from a spreadsheet', rateBlock);
    await page.getByText('Read 6 rows with 2 replicate columns.').waitFor();
    await page.getByText('Units from the header: [S] in mM, v₀ in µM/min.').waitFor();
    expect(await page.getByRole('combobox', { name: '[S] unit' }).inputValue()).toBe('mM');
    expect(await page.getByRole('combobox', { name: 'v₀ unit' }).inputValue()).toBe('µM/min');

    // The live fit of all twelve points is the reference fit.
    const mmPlot = page.getByRole('figure', { name: 'Michaelis–Menten plot' });
    await mmPlot.locator('svg').waitFor();
    await page.locator('td[data-parameter="kcat"]').waitFor();
    expect(relative(await parameterValue(page, 'kcat'), REFERENCE_KCAT_PER_SECOND)).toBeLessThan(1e-6);
    expect(relative(await parameterValue(page, 'Km'), REFERENCE_KM_MOLAR)).toBeLessThan(1e-6);
    await page.getByRole('table', { name: 'Fitted parameters' }).getByText('0.06412').waitFor();
    await page.getByText('Michaelis–Menten against the richer models').waitFor();
    await page.getByRole('figure', { name: 'Residual plot' }).locator('svg').waitFor();
    await screenshot(page, 'assay-entry-live-fit');

    // Live fit per keystroke, in the page: from the key event to the new kcat in the table (the chart's
    // data follow in the same commit). The cell goes 207 → 20 → 206 → 20 → 207 → 20 → 208 µM/min.
    const cell = page.getByRole('textbox', { name: 'Row 6, replicate 1, v₀ (µM/min)' });
    await cell.press('End');
    await page.evaluate(() => {
      const latencies: number[] = [];
      let keyAt = 0;
      (window as unknown as { fitLatencies: number[] }).fitLatencies = latencies;
      document.addEventListener('keydown', (event) => (keyAt = event.timeStamp), true);
      new MutationObserver(() => latencies.push(performance.now() - keyAt)).observe(document.querySelector('td[data-parameter="kcat"]')!, { attributes: true, attributeFilter: ['data-value'] });
    });
    for (const key of ['Backspace', '6', 'Backspace', '7', 'Backspace', '8']) {
      const before = await page.locator('td[data-parameter="kcat"]').getAttribute('data-value');
      await cell.press(key);
      await page.waitForFunction((old) => document.querySelector('td[data-parameter="kcat"]')?.getAttribute('data-value') !== old, before);
    }
    const latencies = (await page.evaluate(() => (window as unknown as { fitLatencies: number[] }).fitLatencies)).sort((a, b) => a - b);
    expect(latencies).toHaveLength(6);
    const fitNote = await page.getByText(/Fitted in this browser in/).textContent();
    console.log(
      `Live fit per keystroke (key event to new parameters on the page, three models, band and flags): median ${((latencies[2] + latencies[3]) / 2).toFixed(0)} ms, ` +
        `max ${latencies[5].toFixed(0)} ms; the fits themselves ${fitNote?.match(/in ([\d.]+) ms/)?.[1]} ms`,
    );
    await cell.press('Backspace');
    await cell.press('7');
    await expect.poll(async () => relative(await parameterValue(page, 'kcat'), REFERENCE_KCAT_PER_SECOND)).toBeLessThan(1e-6);

    // Exclude the low replicate at 0.02 mM by clicking it in the plot.
    await mmPlot.locator('path[aria-label*="[S] (mM): 0.02; v₀ (µM/min): 47;"]').click();
    const dialog = page.getByRole('dialog', { name: 'Exclude this point from the fit' });
    await dialog.waitFor();
    await dialog.getByText('Row 1, replicate 2: [S] 0.02 mM, v₀ 47 µM/min').waitFor();
    await screenshot(page, 'assay-entry-exclude');
    await dialog.getByLabel('Outlier: pipetting or mixing error suspected').check();
    await dialog.getByRole('button', { name: 'Exclude and refit' }).click();
    await page.getByRole('heading', { name: 'Excluded points' }).waitFor();
    // The refit is the fit of the eleven other points, by the same shared code.
    const remaining = S_MM.flatMap((s, row) => V_REPLICATES[row].map((v, replicate) => ({ s, v, excluded: row === 0 && replicate === 1 })));
    const expected = fitAssay(remaining, { model: 'michaelis-menten', sUnit: 'mM', vUnit: 'µM/min', enzymeConcentration: { value: 10, unit: 'nM' } });
    await page.waitForFunction((value) => Math.abs(Number(document.querySelector('td[data-parameter="kcat"]')?.getAttribute('data-value')) / value - 1) < 1e-9, expected.parameters.kcat.value);
    const previewKcat = await parameterValue(page, 'kcat');
    const previewKm = await parameterValue(page, 'Km');
    expect(relative(previewKm, expected.parameters.km.value)).toBeLessThan(1e-9);
    expect(relative(previewKcat, REFERENCE_KCAT_PER_SECOND)).toBeGreaterThan(1e-3);

    // A raw plate-reader file goes with the assay.
    const plateFile = Buffer.from('Well,Time (s),A405\nA1,0,0.051\nA1,30,0.112\n');
    await page.getByLabel('Plate-reader files').setInputFiles({ name: 'plate-2026-03-02.csv', mimeType: 'text/csv', buffer: plateFile });

    // A chart downloads as SVG.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download Michaelis–Menten plot as SVG' }).click()]);
    const svg = readFileSync((await download.path())!, 'utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    expect(download.suggestedFilename()).toBe('assay-michaelis-menten.svg');

    await page.getByRole('button', { name: 'Save assay and measurement' }).click();
    const saved = page.getByText(/Saved: assay \d+ of /);
    await saved.waitFor();
    await page.getByText("The server's fit agrees with the preview.").waitFor();
    await page.getByRole('heading', { name: 'Attached files' }).waitFor();
    await screenshot(page, 'assay-entry-saved');
    const assayId = Number((await saved.textContent())!.match(/assay (\d+)/)![1]);

    // Read back through the API: the stored kcat and Km are the preview's.
    const stored = (await (await page.request.get(`${baseUrl}/api/assays/${assayId}`)).json()) as {
      assay: { measurements: { id: number; kcat: { value: number }; km: { value: number } }[]; currentMeasurementId: number; points: { excluded: boolean; exclusionReason: string | null }[] };
    };
    const measurement = stored.assay.measurements.find((item) => item.id === stored.assay.currentMeasurementId)!;
    expect(relative(measurement.kcat.value, previewKcat)).toBeLessThan(1e-9);
    expect(relative(measurement.km.value, previewKm)).toBeLessThan(1e-9);
    expect(stored.assay.points.filter((point) => point.excluded).map((point) => point.exclusionReason)).toEqual(['Outlier: pipetting or mixing error suspected']);
    const attachments = (await (await page.request.get(`${baseUrl}/api/assays/${assayId}/attachments`)).json()) as { attachments: { originalName: string; sha256: string }[] };
    expect(attachments.attachments).toEqual([expect.objectContaining({ originalName: 'plate-2026-03-02.csv', sha256: createHash('sha256').update(plateFile).digest('hex') })]);
    expect(await cspViolations(page)).toEqual([]);

    // The next assay starts from these conditions.
    await page.goto(`${baseUrl}/assays/new`);
    expect(await page.getByRole('textbox', { name: 'Substrate', exact: true }).inputValue()).toBe('N-butanoyl-4-nitroaniline');
    expect(await page.getByRole('textbox', { name: 'Enzyme [E]t' }).inputValue()).toBe('10');
    expect(await page.getByRole('textbox', { name: 'Metal salt', exact: true }).inputValue()).toBe('ZnCl2');
    await page.close();
  });

  it('refuses to save without conditions, naming the fields', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1100 } });
    await page.addInitScript(() => window.localStorage.clear());
    await signInAs(page, 'kineticist@kcatalog.example');
    await page.goto(`${baseUrl}/assays/new`);
    await paste(page, 'Paste a block from a spreadsheet', rateBlock);
    await page.getByRole('button', { name: 'Save assay and measurement' }).click();
    await page.getByText('Some fields need attention; see the messages beside them.').waitFor();
    expect(await page.getByText('is required').count()).toBeGreaterThanOrEqual(4);
    await screenshot(page, 'assay-entry-errors');
    await page.close();
  });

  it('fits a pasted pH series live, with pKa values, the optimum and candidate residues, and saves it', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1100 } });
    await watchCsp(page);
    await signInAs(page, 'kineticist@kcatalog.example');
    await page.goto(`${baseUrl}/ph-profiles/new?variantId=${variant.id}`);
    await page.getByRole('heading', { name: 'pH profile entry' }).waitFor();
    // The campaign's target substrate and temperature come in once the variant is known.
    await page.waitForFunction(() => (document.querySelector('input[name="substrate"]') as HTMLInputElement | null)?.value !== '');
    await paste(page, 'Paste a block from a spreadsheet', phBlock);
    await page.getByText('Read 15 pH values.').waitFor();
    expect(await page.getByRole('combobox', { name: 'Rate unit' }).inputValue()).toBe('M⁻¹ s⁻¹');
    await page.getByRole('figure', { name: 'pH–rate profile' }).locator('svg').waitFor();
    const table = page.getByRole('table', { name: 'Fitted pH parameters' });
    await table.waitFor();
    expect(Number(await table.locator('td[data-parameter="pKa1"]').getAttribute('data-value'))).toBeCloseTo(4.2, 6);
    expect(Number(await table.locator('td[data-parameter="pKa2"]').getAttribute('data-value'))).toBeCloseTo(8.4, 6);
    expect(await table.locator('td[data-parameter="pH optimum"]').textContent()).toBe('6.30');
    // Free side-chain pKa values (Dawson et al. 1986): Glu 4.07 is nearest 4.2, Cys 8.37 nearest 8.4.
    const candidates = page.getByRole('table', { name: 'Candidate residues' });
    const rows = await candidates.locator('tbody tr').allTextContents();
    expect(rows[0]).toMatch(/^pKa1 4\.20E64acid\/base4\.07\+0\.134\.5$/);
    expect(rows.some((row) => /^pKa2 8\.40C112nucleophile8\.37\+0\.03/.test(row))).toBe(true);
    await screenshot(page, 'ph-profile-entry-live-fit');

    await page.getByRole('button', { name: 'Save pH profile' }).click();
    await page.getByText(/Saved: pH profile \d+ of .* The server's fit agrees with the preview\./).waitFor();
    expect(Number(await page.locator('td[data-stored="pKa1"]').getAttribute('data-value'))).toBeCloseTo(4.2, 6);
    await screenshot(page, 'ph-profile-entry-saved');
    expect(await cspViolations(page)).toEqual([]);
    await page.close();
  });

  it('shows the new assay and pH profile as charts on the Variant page', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1100 } });
    await watchCsp(page);
    await signInAs(page, 'viewer@kcatalog.example');
    await page.goto(`${baseUrl}/variants/${variant.id}`);
    const section = page.locator('#variant-charts');
    await section.scrollIntoViewIfNeeded();
    await section.getByRole('figure', { name: `${variant.label} Michaelis–Menten plot` }).locator('svg').waitFor();
    await section.getByRole('figure', { name: `${variant.label} residual plot` }).locator('svg').waitFor();
    await section.getByRole('figure', { name: `${variant.label} pH–rate profile` }).locator('svg').waitFor();
    // Entered at the campaign's target conditions, so the demo parent is a matched reference.
    await section.getByRole('figure', { name: `${variant.label} against parent chart` }).scrollIntoViewIfNeeded();
    await section.getByRole('figure', { name: `${variant.label} against parent chart` }).locator('svg').waitFor();
    await section.getByRole('link', { name: 'plate-2026-03-02.csv' }).waitFor();
    await section.screenshot({ path: `${import.meta.dirname}/screenshots/variant-charts-new-variant.png` });
    expect(await cspViolations(page)).toEqual([]);
    await page.close();
  });

  it('draws every Variant page chart for a demo variant with a matched parent', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1100 } });
    await watchCsp(page);
    await signInAs(page, 'viewer@kcatalog.example');
    const list = (await (await page.request.get(`${baseUrl}/api/variants?q=Y87D&pageSize=20`)).json()) as { rows: { id: number; label: string }[] };
    const y87d = list.rows.find((row) => row.label === 'Y87D')!;
    await page.goto(`${baseUrl}/variants/${y87d.id}`);
    const section = page.locator('#variant-charts');
    await section.scrollIntoViewIfNeeded();
    for (const name of ['Y87D Michaelis–Menten plot', 'Y87D residual plot', 'Y87D pH–rate profile', 'Y87D against parent chart']) {
      await section.getByRole('figure', { name }).scrollIntoViewIfNeeded();
      await section.getByRole('figure', { name }).locator('svg').waitFor();
    }
    await section.screenshot({ path: `${import.meta.dirname}/screenshots/variant-charts-demo.png` });
    expect(await cspViolations(page)).toEqual([]);
    await page.close();
  });
});
