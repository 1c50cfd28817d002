import type { Browser, Page, Route } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, hasBrowser, openBrowser, screenshot, signInAs } from './session';

// The demo campaign (invented data, see server/seed/demo-scenario.ts): parent AmdT has Glu64, Tyr87,
// Cys112 and His190; Y87D/R215K is a measured double mutant with cycles; W160Y is designed, unmeasured.
const demoCampaign = 'AmdT acid tolerance, round 2';

interface VariantRow {
  id: number;
  label: string;
  version: number;
  status: string;
}

async function api<T>(page: Page, path: string): Promise<T> {
  const response = await page.request.get(`${baseUrl}/api${path}`);
  expect(response.status(), `GET ${path}`).toBe(200);
  return (await response.json()) as T;
}

async function variantByLabel(page: Page, label: string): Promise<VariantRow> {
  const { rows } = await api<{ rows: VariantRow[] }>(page, `/variants?q=${encodeURIComponent(label)}&pageSize=50`);
  const found = rows.find((row) => row.label === label);
  if (!found) throw new Error(`No variant ${label} in the demo data.`);
  return found;
}

/** Sends a write from inside the page, as a client forcing a request the page does not offer. */
async function forcedWrite(page: Page, method: string, path: string, body: unknown): Promise<number> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const { csrfToken } = (await (await fetch('/api/auth/csrf')).json()) as { csrfToken: string };
      const response = await fetch(`/api${path}`, {
        method,
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken },
        body: JSON.stringify(body),
      });
      return response.status;
    },
    { method, path, body },
  );
}

/** Holds matching API responses until released, to show a page while it loads. */
async function holdResponses(page: Page, pattern: RegExp): Promise<() => Promise<void>> {
  const held: Route[] = [];
  const handler = (route: Route) => void held.push(route);
  await page.route(pattern, handler);
  return async () => {
    await Promise.all(held.map((route) => route.continue()));
    await page.unroute(pattern, handler);
  };
}

/**
 * An invented protein sequence: Met, then residues drawn by a fixed linear congruential generator (the
 * Numerical Recipes constants), with chosen residues placed at 1-based positions.
 */
function inventedSequence(length: number, placed: Record<number, string> = {}, seed = 20261201): string {
  const residues = 'ACDEFGHIKLMNPQRSTVWY';
  let state = seed;
  const next = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
  return Array.from({ length }, (_, index) => placed[index + 1] ?? (index === 0 ? 'M' : residues[Math.floor(next() * residues.length)])).join('');
}

describe.skipIf(!hasBrowser)('variant, enzyme, campaign and register pages in the browser', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  // The page of the running test, so a failure leaves a picture of what was on screen.
  let current: Page | null = null;
  afterEach(async (context) => {
    if (context.task.result?.state === 'fail' && current && !current.isClosed()) await screenshot(current, `failed-${context.task.name.slice(0, 40).replace(/\W+/g, '-')}`);
    current = null;
  });

  async function pageAs(role: string): Promise<Page> {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    current = page;
    await signInAs(page, `${role}@kcatalog.example`);
    return page;
  }

  it('lets a biologist register a variant: a wrong parent residue is named as it is typed, the fix is saved and found in the registry', async () => {
    const page = await pageAs('biologist');
    await page.goto(`${baseUrl}/variants/new`);
    await page.getByRole('heading', { name: 'Register a variant' }).waitFor();
    const campaign = page.getByLabel('Campaign');
    const campaignValue = await campaign.locator('option', { hasText: demoCampaign }).getAttribute('value');
    await campaign.selectOption(campaignValue!);
    await page.getByText(/Mutations are read against Ardentimonas amidase AmdT/).waitFor();

    // Position 64 of the parent is Glu (the acid/base residue), so "D64N" names the wrong residue.
    await page.getByLabel('Mutations').fill('D64N');
    await page.getByText('D64N: position 64 of the parent is Glu, not Asp').waitFor();
    await screenshot(page, 'register-variant-wrong-residue');

    await page.getByLabel('Mutations').fill('E64N');
    await page.getByText('Reads as E64N').waitFor();
    await page.getByText('p.Glu64Asn').waitFor();
    await expect(page.getByText(/position 64 of the parent is/).count()).resolves.toBe(0);
    await page.getByLabel('Construct id').fill('pKC-E2E-64N');
    await page.getByLabel('Notes').fill('Registered by the browser test.');
    await screenshot(page, 'register-variant-parsed');
    await page.getByRole('button', { name: 'Register variant' }).click();

    await page.waitForURL(/\/variants\/\d+$/);
    await page.getByRole('heading', { name: 'E64N', level: 1 }).waitFor();
    await page.getByText('No measurements yet.').waitFor();
    await page.getByText('Nothing to compare yet.').waitFor();
    await screenshot(page, 'variant-new-empty');
    const variantUrl = page.url();

    // The same set again is a duplicate: the form links to the variant that exists.
    await page.goto(`${baseUrl}/variants/new?campaignId=${campaignValue}`);
    await page.getByText(/Mutations are read against/).waitFor();
    await page.getByLabel('Mutations').fill('Glu64Asn');
    await page.getByText('Reads as E64N').waitFor();
    await page.getByRole('button', { name: 'Register variant' }).click();
    await page.getByText('This variant is already registered').waitFor();
    await screenshot(page, 'register-variant-duplicate');
    await page.getByRole('link', { name: 'Open E64N' }).click();
    await page.waitForURL(variantUrl);

    await page.goto(`${baseUrl}/registry?q=E64N`);
    await page.getByRole('heading', { name: 'Registry' }).waitFor();
    await page.locator('[role="gridcell"]', { hasText: 'E64N' }).first().waitFor();
    await screenshot(page, 'registry-after-register');
    const created = await variantByLabel(page, 'E64N');
    expect(created.status).toBe('designed');
    await page.close();
  });

  it('lets a lead approve a submitted measurement on the variant page', async () => {
    const page = await pageAs('lead');
    const { items } = await api<{ items: { id: number; version: number; variant: { id: number; label: string } }[] }>(
      page,
      '/measurements?reviewState=submitted&pageSize=1',
    );
    expect(items.length).toBe(1);
    const [submitted] = items;
    await page.goto(`${baseUrl}/variants/${submitted.variant.id}`);
    await page.getByRole('heading', { name: submitted.variant.label, level: 1 }).waitFor();
    const approve = page.getByRole('button', { name: `Approve measurement ${submitted.id}` });
    await approve.waitFor();
    await screenshot(page, 'variant-lead-before-approval');
    await approve.click();
    await page.getByText(`Measurement ${submitted.id} is now approved.`).waitFor();
    await expect(page.getByRole('button', { name: `Approve measurement ${submitted.id}` }).count()).resolves.toBe(0);
    const { measurement } = await api<{ measurement: { reviewState: string; version: number } }>(page, `/measurements/${submitted.id}`);
    expect(measurement).toMatchObject({ reviewState: 'approved', version: submitted.version + 1 });

    // Flagging needs a reason: an empty one is refused on the field, a given one is stored.
    await page.getByRole('button', { name: `Flag… measurement ${submitted.id}` }).click();
    await page.getByRole('button', { name: 'Flag measurement' }).click();
    await page.getByText('is required to flag a measurement').waitFor();
    await page.getByLabel(/^Reason/).fill('Replicate spread is larger than the plate-reader noise; repeat.');
    await screenshot(page, 'variant-flag-reason');
    await page.getByRole('button', { name: 'Flag measurement' }).click();
    await page.getByText(`Measurement ${submitted.id} is now flagged.`).waitFor();
    const flagged = await api<{ measurement: { reviewState: string; reviewReason: string } }>(page, `/measurements/${submitted.id}`);
    expect(flagged.measurement).toMatchObject({ reviewState: 'flagged', reviewReason: 'Replicate spread is larger than the plate-reader noise; repeat.' });
    await page.close();
  });

  it('explains a status change refused for a stale version and reloads on request', async () => {
    const page = await pageAs('biologist');
    const variant = await variantByLabel(page, 'W160Y');
    await page.goto(`${baseUrl}/variants/${variant.id}`);
    await page.getByRole('heading', { name: 'W160Y', level: 1 }).waitFor();
    // Someone else moves the variant on after the page was loaded.
    expect(await forcedWrite(page, 'PATCH', `/variants/${variant.id}`, { version: variant.version, status: 'cloned' })).toBe(200);
    await page.getByLabel('Change status to').selectOption('sequence-verified');
    await page.getByRole('button', { name: 'Save status' }).click();
    await page.getByText('Someone else changed this variant first').waitFor();
    await screenshot(page, 'variant-stale-status');
    await page.getByRole('button', { name: 'Reload the variant' }).click();
    await page.getByText('Cloned from designed').waitFor();
    await page.getByLabel('Change status to').selectOption('sequence-verified');
    await page.getByRole('button', { name: 'Save status' }).click();
    await page.getByText('Sequence-verified from cloned').waitFor();
    expect((await variantByLabel(page, 'W160Y')).status).toBe('sequence-verified');
    await page.close();
  });

  it('shows a viewer no edit controls on the variant, enzyme and campaign pages, and the server refuses a forced change', async () => {
    const page = await pageAs('viewer');
    const variant = await variantByLabel(page, 'Y87D/R215K');
    await page.goto(`${baseUrl}/variants/${variant.id}`);
    await page.getByRole('heading', { name: 'Y87D/R215K', level: 1 }).waitFor();
    await page.getByText('Matched to 3 parent measurements').first().waitFor();
    const editControls = /Save status|Edit construct|Approve|Flag…|Submit for review|Enter an assay|Enter a pH profile/;
    await expect(page.getByRole('button', { name: editControls }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: editControls }).count()).resolves.toBe(0);
    await expect(page.getByLabel('Change status to').count()).resolves.toBe(0);
    await screenshot(page, 'variant-viewer');

    expect(await forcedWrite(page, 'PATCH', `/variants/${variant.id}`, { version: variant.version, status: 'archived' })).toBe(403);
    expect((await variantByLabel(page, 'Y87D/R215K')).status).toBe(variant.status);

    await page.getByRole('link', { name: 'Ardentimonas amidase AmdT' }).first().click();
    await page.getByRole('heading', { name: 'Ardentimonas amidase AmdT', level: 1 }).waitFor();
    await expect(page.getByRole('button', { name: /^Edit$|Add site|Remove/ }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Start a campaign on it' }).count()).resolves.toBe(0);
    await screenshot(page, 'enzyme-viewer');

    await page.getByRole('link', { name: demoCampaign }).click();
    await page.getByRole('heading', { name: demoCampaign, level: 1 }).waitFor();
    await page.getByText("Members' activity").waitFor();
    await expect(page.getByRole('button', { name: 'Edit settings' }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Register a variant' }).count()).resolves.toBe(0);
    await screenshot(page, 'campaign-viewer');
    await page.close();
  });

  it('creates an enzyme from a pasted FASTA of two records, with a site checked live against the picked one', async () => {
    const page = await pageAs('biologist');
    const first = inventedSequence(120, { 40: 'S' });
    const second = inventedSequence(180, { 57: 'C' });
    const name = `Invented esterase E2E-${Date.now().toString(36)}`;

    await page.goto(`${baseUrl}/enzymes/new`);
    await page.getByRole('heading', { name: 'New enzyme' }).waitFor();
    await page.getByLabel('Name').fill(name);
    await page.getByLabel('EC number').fill('3.1.1.1');
    await page.getByLabel('Organism').fill('synthetic construct');
    await page.getByRole('checkbox', { name: 'Zn²⁺' }).check();
    await page.getByLabel('Amino-acid sequence').fill(`>inv-a First invented record\n${first}\n>inv-b Second invented record\n${second.slice(0, 90)}\n${second.slice(90)}\n`);
    await page.getByText('The text holds 2 records: pick the one to use').waitFor();
    await screenshot(page, 'new-enzyme-pick-record');
    await page.getByRole('button', { name: 'Use record inv-b' }).click();
    await page.getByText('180 residues · inv-b Second invented record').waitFor();

    await page.getByRole('button', { name: 'Add a site' }).click();
    const site = page.getByRole('group', { name: 'Site 1' });
    await site.getByLabel('Position').fill('57');
    await site.getByLabel('Residue').fill('Ser');
    await site.getByText('position 57 of the sequence is Cys, not Ser').waitFor();
    await screenshot(page, 'new-enzyme-wrong-site');
    await site.getByLabel('Residue').fill('C');
    await site.getByText(/position 57 of the sequence is Cys$/).waitFor();
    await site.getByLabel('Role').selectOption('nucleophile');
    await site.getByLabel('Expected pKa').fill('8.3');
    await page.getByRole('button', { name: 'C57, Nucleophile' }).waitFor();
    await screenshot(page, 'new-enzyme-ready');
    await page.getByRole('button', { name: 'Create enzyme' }).click();

    await page.waitForURL(/\/enzymes\/\d+$/);
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    await page.getByText('180 residues · 1 annotated site').waitFor();
    const sitesTable = page.getByRole('table', { name: 'Catalytic sites' });
    await sitesTable.getByText('Cys (C)').waitFor();
    await sitesTable.getByText('Nucleophile').waitFor();

    // On the enzyme page a second site is checked the same way before it is added.
    const addSite = page.getByRole('form', { name: 'Annotate a residue' });
    const residue40 = second[39];
    const wrong = residue40 === 'H' ? { letter: 'W', name: 'Trp' } : { letter: 'H', name: 'His' };
    await addSite.getByLabel('Position').fill('40');
    await addSite.getByLabel('Residue').fill(wrong.letter);
    await addSite.getByText(new RegExp(`position 40 of the sequence is \\w{3}, not ${wrong.name}`)).waitFor();
    await addSite.getByLabel('Residue').fill(residue40);
    await addSite.getByText(/position 40 of the sequence is \w{3}$/).waitFor();
    await addSite.getByLabel('Role').selectOption('substrate binding');
    await addSite.getByRole('button', { name: 'Add site' }).click();
    await page.getByText(`${residue40}40 annotated as substrate binding.`).waitFor();
    await page.getByText('180 residues · 2 annotated sites').waitFor();
    await screenshot(page, 'enzyme-created');

    // Editing: a sequence the annotated sites no longer match is refused, with the server's reason on the field.
    await page.getByRole('button', { name: 'Edit', exact: true }).click();
    await page.getByLabel('Amino-acid sequence').fill(first);
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText(/would no longer match .*position 57 of the new sequence/).waitFor();
    await screenshot(page, 'enzyme-edit-refused');
    await page.getByLabel('Amino-acid sequence').fill(second);
    await page.getByLabel('Organism').fill('synthetic construct (codon-optimised)');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText('(version 2)').waitFor();
    await page.getByText('synthetic construct (codon-optimised)').first().waitFor();
    await page.close();
  });

  it('reads an uploaded FASTA file through the server and offers its records', async () => {
    const page = await pageAs('biologist');
    await page.goto(`${baseUrl}/enzymes/new`);
    await page.getByRole('heading', { name: 'New enzyme' }).waitFor();
    const fasta = `>up-1 Uploaded invented one\n${inventedSequence(64)}\n>up-2 Uploaded invented two\n${inventedSequence(75)}\n`;
    await page.locator('input[type="file"]').setInputFiles({ name: 'two-records.fasta', mimeType: 'text/plain', buffer: Buffer.from(fasta) });
    await page.getByText('two-records.fasta holds 2 records: pick the one to use').waitFor();
    await page.getByRole('button', { name: 'Use record up-1' }).click();
    await page.getByText('64 residues · up-1 Uploaded invented one').waitFor();

    await page.locator('input[type="file"]').setInputFiles({ name: 'not-protein.fasta', mimeType: 'text/plain', buffer: Buffer.from('>bad\nMKB1\n') });
    await page.getByText(/not-protein\.fasta: .*'B'/).waitFor();
    await screenshot(page, 'new-enzyme-upload-refused');
    await page.close();
  });

  it('keeps a 1,000-residue sequence map readable, with details for any residue pointed at', async () => {
    const page = await pageAs('biologist');
    const sequence = inventedSequence(1000, { 105: 'C', 333: 'H', 640: 'D', 641: 'E', 998: 'K' });
    const name = `Invented long synthase E2E-${Date.now().toString(36)}`;
    const response = await page.request.post(`${baseUrl}/api/enzymes`, {
      headers: { 'X-CSRF-Token': (await (await page.request.get(`${baseUrl}/api/auth/csrf`)).json()).csrfToken },
      data: {
        name,
        ecNumber: '2.3.1.1',
        organism: 'synthetic construct',
        sequence,
        sites: [
          { position: 105, residue: 'C', role: 'nucleophile', expectedPka: 8.5 },
          { position: 333, residue: 'H', role: 'general base', expectedPka: 6.5 },
          { position: 640, residue: 'D', role: 'metal ligand' },
          { position: 641, residue: 'E', role: 'acid/base' },
          { position: 998, residue: 'K', role: 'electrostatic' },
        ],
      },
    });
    expect(response.status()).toBe(201);
    const enzyme = (await response.json()) as { id: number };
    await page.goto(`${baseUrl}/enzymes/${enzyme.id}`);
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    const map = page.getByRole('list', { name: 'Sequence, 1000 residues' });
    // As many blocks of ten as fit the width, every line numbered, the last ending at residue 1000.
    const lines = await map.getByRole('listitem').evaluateAll((items) => items.map((item) => item.getAttribute('aria-label') ?? ''));
    const perLine = Number(/^Residues 1 to (\d+)$/.exec(lines[0])![1]);
    expect([50, 60, 80, 100]).toContain(perLine);
    expect(lines.length).toBe(Math.ceil(1000 / perLine));
    expect(lines.at(-1)).toBe(`Residues ${(lines.length - 1) * perLine + 1} to 1000`);
    await map.getByRole('button', { name: 'K998, Electrostatic' }).hover();
    await page.getByText('(lysine) · Electrostatic').waitFor();
    await map.locator('[data-position="500"]').hover();
    await page.getByText(/^[A-Z]500 \(/).waitFor();
    await screenshot(page, 'enzyme-sequence-map-1000');
    await page.close();
  });

  it('shows the variant page loading, failing with a retry, full, and for the parent', async () => {
    const page = await pageAs('lead');
    const variant = await variantByLabel(page, 'Y87D/R215K');

    const release = await holdResponses(page, new RegExp(`/api/variants/${variant.id}$`));
    await page.goto(`${baseUrl}/variants/${variant.id}`);
    await page.getByText('Loading the variant…').waitFor();
    await screenshot(page, 'variant-loading');
    await release();
    await page.getByRole('heading', { name: 'Y87D/R215K', level: 1 }).waitFor();

    const failing = new RegExp(`/api/variants/${variant.id}$`);
    await page.route(failing, (route) =>
      route.fulfill({ status: 500, contentType: 'application/json', body: JSON.stringify({ error: { code: 'internal', message: 'The server failed (test).' } }) }),
    );
    await page.reload();
    await page.getByText('This could not be loaded.').waitFor();
    await screenshot(page, 'variant-error');
    await page.unroute(failing);
    await page.getByRole('button', { name: 'Try again' }).click();
    await page.getByRole('heading', { name: 'Y87D/R215K', level: 1 }).waitFor();

    await page.getByRole('article', { name: /^Primary comparison: N-butanoyl-4-nitroaniline · 45 °C · pH 5\.50$/ }).waitFor();
    await page.getByText(/ΔΔG‡ for/).first().waitFor();
    await page.getByRole('article', { name: 'Cycle Y87D/R215K' }).waitFor();
    await page.getByRole('region', { name: 'Rate data and charts' }).waitFor();
    await expect(page.locator('section#variant-charts').count()).resolves.toBe(1);
    // kcal/mol is remembered for the user and changes every energy on the page.
    await page.getByRole('button', { name: 'kcal/mol' }).click();
    await page.getByText(/^−?\d+\.\d+ ± \d+\.\d+ kcal\/mol$/).first().waitFor();
    await screenshot(page, 'variant-full-kcal');
    await page.getByRole('button', { name: 'kJ/mol' }).click();
    await screenshot(page, 'variant-full');

    const parent = await variantByLabel(page, 'parent');
    await page.goto(`${baseUrl}/variants/${parent.id}`);
    await page.getByRole('heading', { name: 'parent', level: 1 }).waitFor();
    await page.getByText(/This is the campaign's parent/).waitFor();
    await screenshot(page, 'variant-parent');
    await page.close();
  });

  it('shows the enzyme list, campaign page and forms in their loading, empty, error and full states', async () => {
    const page = await pageAs('lead');

    const release = await holdResponses(page, /\/api\/enzymes$/);
    await page.goto(`${baseUrl}/enzymes`);
    await page.getByText('Loading enzymes…').waitFor();
    await screenshot(page, 'enzymes-loading');
    await release();
    await page.getByRole('link', { name: 'Ardentimonas amidase AmdT' }).waitFor();
    await screenshot(page, 'enzymes-full');

    await page.route(/\/api\/enzymes$/, (route) => route.fulfill({ status: 200, contentType: 'application/json', body: JSON.stringify({ rows: [], total: 0 }) }));
    await page.reload();
    await page.getByText('No enzymes yet.').waitFor();
    await screenshot(page, 'enzymes-empty');
    await page.unroute(/\/api\/enzymes$/);

    await page.route(/\/api\/enzymes$/, (route) =>
      route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'The database is busy (test).' } }) }),
    );
    await page.reload();
    await page.getByText('The database is busy (test).').waitFor();
    await screenshot(page, 'enzymes-error');
    await page.unroute(/\/api\/enzymes$/);

    const { rows: campaigns } = await api<{ rows: { id: number; name: string }[] }>(page, '/campaigns');
    const campaignId = campaigns.find((campaign) => campaign.name === demoCampaign)!.id;
    await page.route(/\/api\/audit\?/, (route) => route.fulfill({ status: 200, contentType: 'application/json', body: JSON.stringify({ rows: [], total: 0, page: 1, pageSize: 200 }) }));
    await page.goto(`${baseUrl}/campaigns/${campaignId}`);
    await page.getByText('No activity recorded yet.').waitFor();
    await screenshot(page, 'campaign-activity-empty');
    await page.unroute(/\/api\/audit\?/);
    await page.reload();
    await page.getByRole('table', { name: 'Changes per person' }).waitFor();
    await screenshot(page, 'campaign-full');

    await page.getByRole('button', { name: 'Edit settings' }).click();
    await page.getByLabel('Target pH').fill('15');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('must be between 0 and 14').waitFor();
    await screenshot(page, 'campaign-edit-error');
    await page.getByRole('button', { name: 'Cancel' }).click();

    await page.goto(`${baseUrl}/campaigns/new`);
    await page.getByRole('heading', { name: 'New campaign' }).waitFor();
    await page.getByRole('button', { name: 'Create campaign' }).click();
    await page.getByText('is required (one sentence on what the campaign is to achieve)').waitFor();
    await screenshot(page, 'new-campaign-errors');

    await page.goto(`${baseUrl}/campaigns/999999`);
    await page.getByText('There is no such campaign.').waitFor();
    await page.goto(`${baseUrl}/variants/999999`);
    await page.getByText('There is no such variant.').waitFor();
    await screenshot(page, 'variant-missing');
    await page.close();
  });

  it('lets a lead start a campaign from an enzyme and register its first variant there', async () => {
    const page = await pageAs('lead');
    const { rows: enzymes } = await api<{ rows: { id: number; name: string }[] }>(page, '/enzymes');
    const amdt = enzymes.find((enzyme) => enzyme.name === 'Ardentimonas amidase AmdT')!;
    await page.goto(`${baseUrl}/enzymes/${amdt.id}`);
    await page.getByRole('link', { name: 'Start a campaign on it' }).click();
    await page.waitForURL(/\/campaigns\/new\?enzymeId=\d+/);
    const name = `AmdT thermal round E2E-${Date.now().toString(36)}`;
    await page.getByLabel('Name').fill(name);
    await page.getByLabel('Objective').fill('Keep kcat/Km at 60 °C while raising the melting temperature.');
    await page.getByLabel('Target substrate').fill('N-butanoyl-4-nitroaniline');
    await page.getByLabel('Target pH').fill('7.0');
    await page.getByLabel('Target temperature (°C)').fill('60');
    expect(await page.getByLabel('Parent enzyme').inputValue()).toBe(String(amdt.id));
    await screenshot(page, 'new-campaign-filled');
    await page.getByRole('button', { name: 'Create campaign' }).click();
    await page.waitForURL(/\/campaigns\/\d+$/);
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    await page.getByText('60 °C · pH 7.00').waitFor();
    await page.getByText('created the campaign').waitFor();

    await page.getByRole('link', { name: 'Register a variant' }).click();
    await page.getByText(/Mutations are read against Ardentimonas amidase AmdT/).waitFor();
    await page.getByLabel('Mutations').fill('p.[Tyr87Phe;His190Gln]');
    await page.getByText('Reads as Y87F/H190Q').waitFor();
    await page.getByRole('button', { name: 'Register variant' }).click();
    await page.getByRole('heading', { name: 'Y87F/H190Q', level: 1 }).waitFor();
    await page.getByRole('link', { name }).first().waitFor();
    await page.close();
  });
});
