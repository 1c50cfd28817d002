import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CampaignOverviewDto, OverviewDto } from '@shared/schemas/overview';
import type { Campaign } from '@server/modules/campaigns/campaign.entity';
import type { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, setVariantSummary } from '../factories';
import { signInEveryRole } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];
let first: Campaign;
let second: Campaign;
let empty: Campaign;
let unmeasured: Variant;
let ranked: Record<string, Variant>;

// Invented reported values (plumbing fixtures, not kinetics checks).
function enteredBody(variantId: number) {
  return {
    variantId,
    substrate: 'pNP-acetate',
    temperatureC: 37,
    ph: 6,
    assayDate: '2026-03-04',
    kcat: { value: 10, se: 0.5, unit: '1/s' },
    km: { value: 1, se: 0.1, unit: 'mM' },
  };
}

async function enterAndSubmit(variantId: number): Promise<{ id: number; version: number }> {
  const created = (await as('kineticist').post('/api/measurements', enteredBody(variantId)).expect(201)).body.measurement;
  const submitted = await as('kineticist').post(`/api/measurements/${created.id}/review`, { version: created.version, action: 'submit' }).expect(200);
  return submitted.body.measurement;
}

function overviewOf(body: OverviewDto, campaign: Campaign): CampaignOverviewDto {
  const found = body.campaigns.find((entry) => entry.campaign.id === campaign.id);
  if (!found) throw new Error(`campaign ${campaign.id} is missing from the overview`);
  return found;
}

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as } = await signInEveryRole(testApp.app));
  const { dataSource } = testApp;
  const enzyme = await createEnzymeRow(dataSource);

  const withParent = await createCampaignWithParent(dataSource, { enzyme });
  first = withParent.campaign;
  await setVariantSummary(dataSource, withParent.parent.id, { summaryDdgKjPerMol: 0, summaryDdgSeKjPerMol: 0.1, summaryFoldChange: 1 });
  // ΔΔG‡ in kJ/mol; the fold change is exp(−ΔΔG‡/RT), rounded (the values only have to travel).
  const ddgs: Record<string, number> = { G1A: 2, A2G: -1, S3A: -3, T4A: -0.5, V5A: 4, L6A: 1 };
  ranked = {};
  for (const [label, ddg] of Object.entries(ddgs)) {
    const position = Number(label.slice(1, -1));
    const variant = await createVariantRow(dataSource, {
      campaign: first,
      mutations: [{ position, from: label[0], to: label.at(-1)! }],
      status: 'characterized',
    });
    await setVariantSummary(dataSource, variant.id, {
      summaryDdgKjPerMol: ddg,
      summaryDdgSeKjPerMol: 0.2,
      summaryFoldChange: Number(Math.exp(-ddg / 2.58).toFixed(3)),
    });
    ranked[label] = variant;
  }
  unmeasured = await createVariantRow(dataSource, { campaign: first, mutations: [{ position: 7, from: 'K', to: 'A' }], status: 'purified' });

  second = (await createCampaignWithParent(dataSource, { enzyme })).campaign;
  const secondVariant = await createVariantRow(dataSource, { campaign: second, mutations: [{ position: 8, from: 'E', to: 'A' }] });
  await enterAndSubmit(secondVariant.id);

  empty = (await createCampaignWithParent(dataSource, { enzyme })).campaign;
  await dataSource.query(`UPDATE campaigns SET status = 'paused' WHERE id = ?`, [empty.id]);

  // In the first campaign: one submitted, one approved, one submitted but superseded by a refit.
  await enterAndSubmit(unmeasured.id);
  const approved = await enterAndSubmit(unmeasured.id);
  const superseded = await enterAndSubmit(unmeasured.id);
  await dataSource.query(`UPDATE measurements SET superseded_by_id = ? WHERE id = ?`, [approved.id, superseded.id]);
  await as('lead').post(`/api/measurements/${approved.id}/review`, { version: approved.version, action: 'approve' }).expect(200);
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('GET /api/overview', () => {
  it('returns 401 when signed out', async () => {
    await request(testApp.app).get('/api/overview').expect(401);
  });

  it('refuses an unknown parameter with a 400 that names it', async () => {
    const response = await as('viewer').get('/api/overview?campaign=1').expect(400);
    expect(response.body.error.code).toBe('validation_error');
    expect(response.body.error.message).toMatch(/unknown parameter 'campaign'/);
  });

  it('lists active campaigns by name before paused ones, with their variant counts', async () => {
    const body = (await as('viewer').get('/api/overview').expect(200)).body as OverviewDto;
    expect(body.campaigns.map((entry) => entry.campaign.id)).toEqual([first.id, second.id, empty.id]);
    const counts = overviewOf(body, first).campaign.variantCounts;
    expect(counts.characterized).toBe(6);
    // The parent and the unmeasured variant.
    expect(counts.purified).toBe(2);
    expect(overviewOf(body, first).campaign.variantTotal).toBe(8);
  });

  it('ranks the best variants by ΔΔG‡, most negative first, leaving out the parent and unmeasured variants', async () => {
    const body = (await as('viewer').get('/api/overview').expect(200)).body as OverviewDto;
    const best = overviewOf(body, first).bestVariants;
    expect(best.map((row) => row.label)).toEqual(['S3A', 'A2G', 'T4A', 'L6A', 'G1A']);
    expect(best[0].ddg).toEqual({ value: -3, se: 0.2, unit: 'kJ/mol' });
    expect(best[0].foldChange).toBeCloseTo(Math.exp(3 / 2.58), 3);
    expect(best.some((row) => row.id === ranked.V5A.id)).toBe(false);
    expect(overviewOf(body, empty).bestVariants).toEqual([]);
  });

  it('counts only submitted measurements that are not superseded, per campaign', async () => {
    const body = (await as('viewer').get('/api/overview').expect(200)).body as OverviewDto;
    expect(overviewOf(body, first).awaitingReview).toBe(1);
    expect(overviewOf(body, second).awaitingReview).toBe(1);
    expect(overviewOf(body, empty).awaitingReview).toBe(0);
  });

  it('shows the latest audit events of the campaign, newest first, with the variant they concern', async () => {
    const body = (await as('viewer').get('/api/overview').expect(200)).body as OverviewDto;
    const activity = overviewOf(body, first).recentActivity;
    // Three entries (assay, measurement, submit: 9 events) and one approval: the newest 8 are shown.
    expect(activity).toHaveLength(8);
    expect(activity[0]).toMatchObject({ entityType: 'measurement', action: 'approve', actor: { name: 'Tomas Varga-Reyes' } });
    expect(activity.every((event) => event.variant?.id === unmeasured.id && event.variant.label === 'K7A')).toBe(true);
    expect(activity.every((event) => event.campaignId === first.id)).toBe(true);
    const ids = activity.map((event) => event.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    expect(overviewOf(body, empty).recentActivity).toEqual([]);
  });
});
