import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { settleImports } from '@server/modules/imports/imports.service';
import { setVariantSummary } from '../factories';
import { binary, csv, imported, readWorkbook, type Cell } from './import-fixtures';
import { campaignBody, enzymeBody, uniqueName } from './registry-fixtures';
import { signInEveryRole } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];
let sessions: Awaited<ReturnType<typeof signInEveryRole>>['sessions'];
let enzymeId: number;

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as, sessions } = await signInEveryRole(testApp.app));
  enzymeId = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body.id;
});

afterAll(async () => {
  await settleImports(testApp.dataSource);
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

async function download(path: string, role: 'lead' | 'viewer' = 'lead'): Promise<Buffer> {
  const response = await sessions[role].agent.get(path).buffer(true).parse(binary);
  expect(response.status, (response.body as Buffer).toString('utf8').slice(0, 300)).toBe(200);
  return response.body as Buffer;
}

function parseCsv(buffer: Buffer): string[][] {
  const text = buffer.toString('utf8');
  expect(text.startsWith('\ufeff')).toBe(true);
  return Papa.parse<string[]>(text.slice(1), { skipEmptyLines: true }).data;
}

describe('GET /api/exports/variants.(xlsx|csv)', () => {
  let campaign: { id: number; name: string };
  const variantIds: Record<string, number> = {};

  beforeAll(async () => {
    campaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
    for (const [mutations, notes] of [
      ['S112A', '=1+2'],
      ['H190N', '+SUM(A1:A9)'],
      ['W150F', '-2+3'],
      ['D230N', '@cmd'],
      ['C45S', '\tindented'],
      ['T34A', '\rreturn'],
      ['A12G', 'plain text'],
    ]) {
      const { body } = await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations, notes, constructId: `pX-${mutations}` }).expect(201);
      variantIds[body.label] = body.id;
    }
    // The API trims text, so leading tabs and carriage returns can only come from elsewhere (a bulk load, an older
    // tool); the export must guard them all the same.
    await testApp.dataSource.query(`UPDATE variants SET notes = ? WHERE id = ?`, ['\tindented', variantIds.C45S]);
    await testApp.dataSource.query(`UPDATE variants SET notes = ? WHERE id = ?`, ['\rreturn', variantIds.T34A]);
    await setVariantSummary(testApp.dataSource, variantIds.S112A, { summaryFoldChange: 0.2, summaryDdgKjPerMol: 4.1, summaryDdgSeKjPerMol: 0.3 });
    await setVariantSummary(testApp.dataSource, variantIds.H190N, { summaryFoldChange: 3.5, summaryDdgKjPerMol: -3.2, summaryDdgSeKjPerMol: 0.2 });
    await setVariantSummary(testApp.dataSource, variantIds.W150F, { summaryFoldChange: 1.4, summaryDdgKjPerMol: -0.9, summaryDdgSeKjPerMol: 0.25 });
  });

  it('exports the rows GET /api/variants returns, with the same filters and sort', async () => {
    const query = `campaignId=${campaign.id}&minFoldChange=1&sort=foldChange&order=desc`;
    const list = await sessions.lead.agent.get(`/api/variants?${query}`).expect(200);
    const sheets = await readWorkbook(await download(`/api/exports/variants.xlsx?${query}`));
    const rows = sheets.Variants;
    expect(rows.slice(1).map((row) => row[1])).toEqual(list.body.rows.map((row: { label: string }) => row.label));
    expect(rows.slice(1).map((row) => row[1])).toEqual(['H190N', 'W150F']);
    const byLabel = await sessions.lead.agent.get(`/api/variants?campaignId=${campaign.id}&sort=label`).expect(200);
    const all = parseCsv(await download(`/api/exports/variants.csv?campaignId=${campaign.id}&sort=label`));
    expect(all.slice(1).map((row) => row[1])).toEqual(byLabel.body.rows.map((row: { label: string }) => row.label));
    expect(all).toHaveLength(9);
  });

  it('writes numbers as numbers, units in the headers, and dates as dates', async () => {
    const [headers, first] = (await readWorkbook(await download(`/api/exports/variants.xlsx?campaignId=${campaign.id}&sort=foldChange&order=desc`))).Variants;
    expect(headers).toEqual(expect.arrayContaining(['kcat (s⁻¹)', 'Km (M)', 'kcat/Km (M⁻¹ s⁻¹)', 'ΔΔG‡ (kJ/mol)', 'ΔΔG‡ SE (kJ/mol)']));
    const column = (name: string) => first[(headers as string[]).indexOf(name)];
    expect(column('Mutations')).toBe('H190N');
    expect(column('Fold change (kcat/Km over parent)')).toBe(3.5);
    expect(column('ΔΔG‡ (kJ/mol)')).toBe(-3.2);
    expect(column('Updated')).toBeInstanceOf(Date);
    expect(column('Construct id')).toBe('pX-H190N');
  });

  it('neutralises text a spreadsheet would run as a formula (OWASP CSV injection), in .xlsx and .csv, but not numbers', async () => {
    // OWASP, "CSV Injection": cells starting with =, +, -, @, tab or carriage return get a leading single quote.
    const expected: Record<string, string> = {
      S112A: "'=1+2",
      H190N: "'+SUM(A1:A9)",
      W150F: "'-2+3",
      D230N: "'@cmd",
      C45S: "'\tindented",
      T34A: "'\rreturn",
      A12G: 'plain text',
    };
    const xlsx = (await readWorkbook(await download(`/api/exports/variants.xlsx?campaignId=${campaign.id}&sort=label`))).Variants;
    const csvRows = parseCsv(await download(`/api/exports/variants.csv?campaignId=${campaign.id}&sort=label`));
    const notesColumn = (xlsx[0] as string[]).indexOf('Notes');
    const ddgColumn = (xlsx[0] as string[]).indexOf('ΔΔG‡ (kJ/mol)');
    for (const [format, rows] of [['xlsx', xlsx], ['csv', csvRows]] as const) {
      const byLabel = new Map(rows.slice(1).map((row) => [row[1] as string, row]));
      for (const [label, notes] of Object.entries(expected)) {
        // An XML reader turns a carriage return into a line feed (XML 1.0, §2.11 End-of-Line Handling).
        expect(byLabel.get(label)![notesColumn]).toBe(format === 'xlsx' ? notes.replace('\r', '\n') : notes);
      }
    }
    const h190n = csvRows.find((row) => row[1] === 'H190N')!;
    expect(h190n[ddgColumn]).toBe('-3.2');
    const raw = (await download(`/api/exports/variants.csv?campaignId=${campaign.id}&sort=label`)).toString('utf8');
    expect(raw).toContain(',-3.2,');
    expect(raw).not.toContain(",'-3.2");
  });

  it('refuses a bad filter with the list’s 400, and lets a viewer export', async () => {
    const bad = await sessions.lead.agent.get(`/api/exports/variants.xlsx?sort=bogus&colour=red`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('_');
    const sort = await sessions.lead.agent.get(`/api/exports/variants.csv?sort=bogus`);
    expect(sort.status).toBe(400);
    expect(sort.body.error.fields.sort).toMatch(/must be one of label/);
    const format = await sessions.lead.agent.get(`/api/exports/variants.pdf`);
    expect(format.status).toBe(400);
    expect(format.body.error.fields.format).toBe('must be xlsx or csv');
    await download(`/api/exports/variants.csv?campaignId=${campaign.id}`, 'viewer');
  });
});

// Puromycin, treated (Bates & Watts 1988, Appendix A1.3), read as mM and µM/min.
const puromycinS = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const puromycinV = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];

describe('GET /api/exports/campaigns/:id/measurements', () => {
  it('exports the measurements with a sheet of rate points and one of conditions; 404 for an unknown campaign', async () => {
    const campaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
    const variant = (await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112A' }).expect(201)).body;
    await as('kineticist')
      .post('/api/assays', {
        variantId: variant.id,
        substrate: 'anilide',
        temperatureC: 37,
        ph: 5.5,
        assayDate: '2026-04-01',
        enzymeConcentration: { value: 10, unit: 'nM' },
        points: puromycinS.map((s, index) => ({ s, v: puromycinV[index] })),
        sUnit: 'mM',
        vUnit: 'µM/min',
        model: 'michaelis-menten',
      })
      .expect(201);
    const sheets = await readWorkbook(await download(`/api/exports/campaigns/${campaign.id}/measurements.xlsx`));
    expect(Object.keys(sheets)).toEqual(['Measurements', 'Rate points', 'Conditions']);
    expect(sheets.Measurements).toHaveLength(2);
    expect(sheets['Rate points']).toHaveLength(13);
    expect(sheets.Conditions).toHaveLength(2);
    const [headers, row] = sheets.Measurements as [string[], unknown[]];
    expect(row[headers.indexOf('Assay date')]).toBeInstanceOf(Date);
    expect(row[headers.indexOf('kcat (s⁻¹)')]).toBeCloseTo(354.47, 1);
    const points = parseCsv(await download(`/api/exports/campaigns/${campaign.id}/measurements.csv?sheet=rate-points`));
    expect(points[0]).toContain('[S] (M)');
    expect(Number(points[1][points[0].indexOf('[S] (M)')])).toBeCloseTo(2e-5, 18);
    const unknown = await sessions.lead.agent.get(`/api/exports/campaigns/999999/measurements.xlsx`);
    expect(unknown.status).toBe(404);
    const badSheet = await sessions.lead.agent.get(`/api/exports/campaigns/${campaign.id}/measurements.csv?sheet=everything`);
    expect(badSheet.status).toBe(400);
    expect(badSheet.body.error.fields.sheet).toBe('must be one of measurements, rate-points, conditions');
  });
});

/** Compares two exports cell by cell, numbers to 1e-9 relative, leaving out the columns named. */
function expectSameTable(actual: unknown[][], expected: unknown[][], ignored: readonly string[]) {
  const headers = expected[0] as string[];
  expect(actual[0]).toEqual(headers);
  expect(actual).toHaveLength(expected.length);
  const kept = headers.map((header, index) => (ignored.includes(header) ? -1 : index)).filter((index) => index >= 0);
  expected.slice(1).forEach((row, rowIndex) => {
    for (const column of kept) {
      const want = row[column];
      const got = actual[rowIndex + 1][column];
      if (typeof want === 'number' && typeof got === 'number') {
        expect(Math.abs(got - want), `${headers[column]} of row ${rowIndex + 2}`).toBeLessThanOrEqual(1e-9 * Math.abs(want));
      } else if (want instanceof Date) {
        expect((got as Date).getTime(), `${headers[column]} of row ${rowIndex + 2}`).toBe(want.getTime());
      } else {
        expect(got, `${headers[column]} of row ${rowIndex + 2}`).toEqual(want);
      }
    }
  });
}

describe('round trip', () => {
  it('exporting and re-importing yields identical records, in the same registry and in a fresh one', async () => {
    const campaignName = uniqueName('Round-trip campaign');
    const campaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId, { name: campaignName })).expect(201)).body;
    const variants: Cell[][] = [
      ['Campaign', 'Mutations', 'Status', 'Construct id', 'Notes', 'Lineage parent'],
      [campaignName, 'S112A', 'characterized', 'pRT-1', '=not a formula', null],
      [campaignName, 'S112A/H190N', 'purified', 'pRT-2', '+also text', 'S112A'],
      [campaignName, 'W150F', 'cloned', null, 'plain, with a comma', null],
    ];
    await imported(sessions.lead, 'variants', 'rt-variants.csv', csv(variants));
    const measurements: Cell[][] = [
      ['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Buffer', 'Buffer concentration (mM)', 'Metal salt', 'Metal concentration (µM)', 'Enzyme concentration (nM)', 'Assay date', 'kcat (1/min)', 'kcat SE (1/min)', 'Km (mM)', 'Km SE (mM)', 'Replicates', 'Fitting method'],
      [campaignName, 'S112A', 'anilide', 37, 5.5, 'MES', 50, 'ZnCl2', 10, 20, '2026-05-01', 600, 30, 1.2, 0.1, 3, 'reported by the collaborating lab'],
      [campaignName, 'S112A/H190N', 'anilide', 37, 5.5, 'MES', 50, null, null, null, '2026-05-02', 30, 3, 2.5, 0.4, null, null],
      [campaignName, 'parent', 'anilide', 37, 5.5, 'MES', 50, 'ZnCl2', 10, 20, '2026-05-01', 1200, 60, 1, 0.08, 2, 'reported'],
    ];
    await imported(sessions.kineticist, 'measurements', 'rt-measurements.csv', csv(measurements));
    const variantId = (await testApp.dataSource.query(`SELECT id FROM variants WHERE campaign_id = ? AND label = 'W150F'`, [campaign.id]))[0].id;
    await as('kineticist')
      .post('/api/assays', {
        variantId,
        substrate: 'anilide',
        temperatureC: 37,
        ph: 5.5,
        buffer: { name: 'MES', concentration: { value: 50, unit: 'mM' } },
        assayDate: '2026-05-03',
        enzymeConcentration: { value: 10, unit: 'nM' },
        points: puromycinS.map((s, index) => ({ s, v: puromycinV[index], replicate: (index % 2) + 1, excluded: index === 1, exclusionReason: index === 1 ? 'bubble in the cuvette' : null })),
        sUnit: 'mM',
        vUnit: 'µM/min',
        model: 'michaelis-menten',
      })
      .expect(201);

    const variantsExport = await download(`/api/exports/variants.xlsx?campaignId=${campaign.id}&sort=label`);
    const measurementsExport = await download(`/api/exports/campaigns/${campaign.id}/measurements.xlsx`);
    const exported = { ...(await readWorkbook(variantsExport)), ...(await readWorkbook(measurementsExport)) };

    // The same registry: every row matches what is stored, so nothing changes.
    for (const [kind, file, sheet] of [
      ['variants', variantsExport, 'Variants'],
      ['measurements', measurementsExport, 'Measurements'],
      ['rate-points', measurementsExport, 'Rate points'],
    ] as const) {
      const job = await imported(sessions.lead, kind, `${kind}.xlsx`, file, { sheet });
      expect(job.counts, `${kind}: ${JSON.stringify(job.problems.slice(0, 3))}`).toMatchObject({ new: 0, updated: 0, invalid: 0 });
    }

    // A fresh registry with the same parent enzyme and campaign name: import the three sheets and export again.
    const fresh = await createTestApp();
    try {
      const other = await signInEveryRole(fresh.app);
      const freshEnzyme = (await other.as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body.id;
      const freshCampaign = (await other.as('lead').post('/api/campaigns', campaignBody(freshEnzyme, { name: campaignName })).expect(201)).body;
      const variantsJob = await imported(other.sessions.lead, 'variants', 'variants.xlsx', variantsExport, { sheet: 'Variants' });
      expect(variantsJob.counts).toEqual({ new: 3, updated: 0, unchanged: 1, invalid: 0 });
      const pointsJob = await imported(other.sessions.kineticist, 'rate-points', 'measurements.xlsx', measurementsExport, { sheet: 'Rate points' });
      expect(pointsJob.counts.new).toBe(12);
      const measurementsJob = await imported(other.sessions.kineticist, 'measurements', 'measurements.xlsx', measurementsExport, { sheet: 'Measurements' });
      expect(measurementsJob.counts).toEqual({ new: 3, updated: 0, unchanged: 1, invalid: 0 });

      const again = async (path: string) => {
        const response = await other.sessions.lead.agent.get(path).buffer(true).parse(binary).expect(200);
        return readWorkbook(response.body as Buffer);
      };
      const reimported = { ...(await again(`/api/exports/variants.xlsx?campaignId=${freshCampaign.id}&sort=label`)), ...(await again(`/api/exports/campaigns/${freshCampaign.id}/measurements.xlsx`)) };
      expectSameTable(reimported.Variants, exported.Variants, ['Updated']);
      // Ids differ between registries, and the conditions sheet names the units the points were typed in.
      expectSameTable(reimported.Measurements, exported.Measurements, ['Measurement id', 'Assay id']);
      expectSameTable(reimported['Rate points'], exported['Rate points'], ['Assay']);
      expectSameTable(reimported.Conditions, exported.Conditions, ['Assay', 'Entered S unit', 'Entered v0 unit']);
      await settleImports(fresh.dataSource);
    } finally {
      await fresh.close();
      removeDataDir(fresh.dataDir);
    }
  }, 120_000);
});
