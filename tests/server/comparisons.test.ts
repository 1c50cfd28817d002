import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Campaign } from '@server/modules/campaigns/campaign.entity';
import type { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, inventedSequence } from '../factories';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

// Expected values are worked by hand from ΔΔG‡ = −RT ln(k_variant/k_parent) (Fersht, Structure and Mechanism
// in Protein Science, 1999, ch. 15) with R = 8.31446261815324 J mol⁻¹ K⁻¹ (CODATA 2018, exact), relative
// errors propagated as independent (Taylor, An Introduction to Error Analysis, 2nd ed., §3.8), replicates
// combined by inverse-variance weighting (Taylor §7.2) and the double-mutant cycle
// ΔΔG_int = −RT ln(k_AB·k_P/(k_A·k_B)) (Carter et al., Cell 38 (1984) 835). All measurements are invented.
const R = 8.31446261815324;
const kelvin = (celsius: number) => celsius + 273.15;
const rtKj = (celsius: number) => (R * kelvin(celsius)) / 1000;

let testApp: TestApp;
let campaign: Campaign;
let parent: Variant;
let s112a: Variant;
let h190n: Variant;
let double: Variant;
let d45e: Variant;
let d45n: Variant;
let kineticist: Awaited<ReturnType<typeof signedIn>>;

async function enter(variantId: number, conditions: { temperatureC: number; ph: number }, kcat: [number, number], kcatOverKm: [number, number]) {
  const response = await kineticist.agent
    .post('/api/measurements')
    .set('X-CSRF-Token', kineticist.csrfToken)
    .send({
      variantId,
      substrate: 'pNP-acetate',
      ...conditions,
      assayDate: '2026-03-05',
      kcat: { value: kcat[0], se: kcat[1], unit: '1/s' },
      km: { value: kcat[0] / kcatOverKm[0], se: (0.1 * kcat[0]) / kcatOverKm[0], unit: 'M' },
      kcatOverKm: { value: kcatOverKm[0], se: kcatOverKm[1], unit: 'M⁻¹ s⁻¹' },
    })
    .expect(201);
  return response.body.measurement as { id: number; version: number };
}

async function summaryOf(id: number) {
  const [row] = (await testApp.dataSource.query(
    `SELECT summary_kcat_over_km, summary_fold_change, summary_ddg_kj_per_mol, summary_ddg_se_kj_per_mol, summary_measurement_count, summary_flags, version
       FROM variants WHERE id = ?`,
    [id],
  )) as {
    summary_kcat_over_km: number | null;
    summary_fold_change: number | null;
    summary_ddg_kj_per_mol: number | null;
    summary_ddg_se_kj_per_mol: number | null;
    summary_measurement_count: number;
    summary_flags: string;
    version: number;
  }[];
  return row;
}

const at37 = { temperatureC: 37, ph: 6 };
let s112aMeasurement: { id: number; version: number };

beforeAll(async () => {
  testApp = await createTestApp();
  const sequence = inventedSequence(300, { 45: 'D', 112: 'S', 190: 'H' });
  const enzyme = await createEnzymeRow(testApp.dataSource, {
    sequence,
    sites: [
      { position: 45, residue: 'D', role: 'general acid' },
      { position: 112, residue: 'S', role: 'nucleophile' },
      { position: 190, residue: 'H', role: 'general base' },
    ],
  });
  ({ campaign, parent } = await createCampaignWithParent(testApp.dataSource, { enzyme, targetSubstrate: 'pNP-acetate', targetPh: 6, targetTemperatureC: 37 }));
  const S112A = { position: 112, from: 'S', to: 'A' };
  const H190N = { position: 190, from: 'H', to: 'N' };
  s112a = await createVariantRow(testApp.dataSource, { campaign, mutations: [S112A] });
  h190n = await createVariantRow(testApp.dataSource, { campaign, mutations: [H190N] });
  double = await createVariantRow(testApp.dataSource, { campaign, mutations: [S112A, H190N] });
  d45e = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 45, from: 'D', to: 'E' }] });
  d45n = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 45, from: 'D', to: 'N' }], status: 'designed' });

  kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
  await enter(parent.id, at37, [10, 0.5], [1e4, 500]);
  // A parent measurement under other conditions, which no variant below may be compared with.
  await enter(parent.id, { temperatureC: 25, ph: 7 }, [4, 0.2], [8e3, 400]);
  s112aMeasurement = await enter(s112a.id, { temperatureC: 37.2, ph: 6.05 }, [0.01, 0.001], [5, 0.5]);
  await enter(h190n.id, at37, [1, 0.1], [1000, 100]);
  await enter(h190n.id, at37, [1.1, 0.1], [1200, 200]);
  await enter(double.id, at37, [0.005, 0.0005], [2, 0.2]);
  await enter(d45e.id, { temperatureC: 30, ph: 6 }, [5, 0.5], [5e3, 250]);
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('GET /api/variants/:id/comparison', () => {
  it('compares with the matched parent at the assay temperature, checked against the formula', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { body } = await viewer.agent.get(`/api/variants/${s112a.id}/comparison`).expect(200);
    expect(body.variant).toEqual({ id: s112a.id, label: 'S112A', campaignId: campaign.id, isParent: false });
    expect(body.parentVariant).toEqual({ id: parent.id, label: 'parent' });
    expect(body.target).toEqual({ substrate: 'pNP-acetate', temperatureC: 37, ph: 6 });
    expect(body.comparisons).toHaveLength(1);
    const primary = body.primary;
    expect(primary).toMatchObject({ matched: true, reason: null, temperatureC: 37.2, ph: 6.05, onTargetSubstrate: true });
    // 5 ± 0.5 against 10⁴ ± 500 M⁻¹ s⁻¹ at 37.2 °C.
    expect(primary.ddgKcatOverKm.kJPerMol.value).toBeCloseTo(-rtKj(37.2) * Math.log(5 / 1e4), 10);
    expect(primary.ddgKcatOverKm.kJPerMol.se).toBeCloseTo(rtKj(37.2) * Math.hypot(0.1, 0.05), 10);
    // 0.01 ± 0.001 against 10 ± 0.5 s⁻¹.
    expect(primary.ddgKcat.kJPerMol.value).toBeCloseTo(-rtKj(37.2) * Math.log(0.01 / 10), 10);
    expect(primary.foldChange.value).toBeCloseTo(5e-4, 14);
    expect(primary.log10FoldChange).toBeCloseTo(Math.log10(5e-4), 12);
    // Km = kcat/(kcat/Km): 0.002 M against 0.001 M.
    expect(primary.kmRatio.value).toBeCloseTo(2, 10);
    expect(primary.variant.kcatOverKm).toEqual({ value: 5, se: 0.5, n: 1, unit: 'M⁻¹ s⁻¹' });
    expect(primary.parent.kcat).toEqual({ value: 10, se: 0.5, n: 1, unit: 's⁻¹' });
  });

  it('combines replicates by inverse-variance weighting', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { primary } = (await viewer.agent.get(`/api/variants/${h190n.id}/comparison`).expect(200)).body;
    // 1000 ± 100 and 1200 ± 200: weights 1 : 1/4 → 1040 ± 1/√(1/100² + 1/200²) = 89.4427191.
    expect(primary.variant.kcatOverKm.value).toBeCloseTo(1040, 9);
    expect(primary.variant.kcatOverKm.se).toBeCloseTo(89.44271909999159, 9);
    expect(primary.variant.kcatOverKm.n).toBe(2);
    expect(primary.ddgKcatOverKm.kJPerMol.value).toBeCloseTo(-rtKj(37) * Math.log(1040 / 1e4), 10);
    expect(primary.ddgKcatOverKm.kJPerMol.se).toBeCloseTo(rtKj(37) * Math.hypot(89.44271909999159 / 1040, 0.05), 10);
  });

  it('says why there is no comparison when no parent measurement matches, and gives no number', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { primary } = (await viewer.agent.get(`/api/variants/${d45e.id}/comparison`).expect(200)).body;
    expect(primary).toMatchObject({
      matched: false,
      reason: 'no parent measurement with substrate pNP-acetate within 0.5 °C and 0.1 pH of 30.0 °C, pH 6.0',
      parent: null,
      ddgKcatOverKm: null,
      ddgKcat: null,
      foldChange: null,
      log10FoldChange: null,
      kmRatio: null,
    });
    expect((await viewer.agent.get(`/api/variants/${d45n.id}/comparison`).expect(200)).body).toMatchObject({ comparisons: [], primary: null });
  });

  it('gives the parent itself ratio 1 and ΔΔG‡ 0, and prefers its target-condition group', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const body = (await viewer.agent.get(`/api/variants/${parent.id}/comparison`).expect(200)).body;
    expect(body.variant.isParent).toBe(true);
    expect(body.comparisons.map((comparison: { temperatureC: number }) => comparison.temperatureC)).toEqual([37, 25]);
    expect(body.primary.ddgKcatOverKm.kJPerMol).toEqual({ value: 0, se: 0 });
    expect(body.primary.foldChange).toEqual({ value: 1, se: 0 });
  });

  it('counts only the requested review states', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const none = (await viewer.agent.get(`/api/variants/${s112a.id}/comparison?states=submitted,approved`).expect(200)).body;
    expect(none).toMatchObject({ reviewStates: ['submitted', 'approved'], comparisons: [], primary: null });
    const submitted = (
      await kineticist.agent
        .post(`/api/measurements/${s112aMeasurement.id}/review`)
        .set('X-CSRF-Token', kineticist.csrfToken)
        .send({ version: s112aMeasurement.version, action: 'submit' })
        .expect(200)
    ).body.measurement;
    await lead.agent
      .post(`/api/measurements/${s112aMeasurement.id}/review`)
      .set('X-CSRF-Token', lead.csrfToken)
      .send({ version: submitted.version, action: 'approve' })
      .expect(200);
    // The variant's measurement now counts, but every parent measurement is still a draft.
    const approvedOnly = (await viewer.agent.get(`/api/variants/${s112a.id}/comparison?states=approved`).expect(200)).body;
    expect(approvedOnly.primary).toMatchObject({ matched: false, reason: 'the parent has no measurements to compare with' });
    const bad = await viewer.agent.get(`/api/variants/${s112a.id}/comparison?states=flagged`).expect(400);
    expect(bad.body.error.fields).toEqual({ states: 'must list states among draft, submitted, approved' });
  });

  it('answers 404 for an unknown variant and 400 for a bad id', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    await viewer.agent.get('/api/variants/999999/comparison').expect(404);
    await viewer.agent.get('/api/variants/x/comparison').expect(400);
  });
});

describe('variant summaries', () => {
  it('hold the primary comparison’s numbers without bumping the version', async () => {
    const summary = await summaryOf(s112a.id);
    expect(summary.summary_ddg_kj_per_mol).toBeCloseTo(-rtKj(37.2) * Math.log(5 / 1e4), 10);
    expect(summary.summary_ddg_se_kj_per_mol).toBeCloseTo(rtKj(37.2) * Math.hypot(0.1, 0.05), 10);
    expect(summary.summary_fold_change).toBeCloseTo(5e-4, 14);
    expect(summary.summary_kcat_over_km).toBe(5);
    expect(summary.summary_measurement_count).toBe(1);
    expect(summary.version).toBe(s112a.version);
    // Entered without substrate range, enzyme concentration, replicates or fitting method.
    expect(summary.summary_flags).toBe('incomplete-reporting');
    const unmatched = await summaryOf(d45e.id);
    expect(unmatched.summary_ddg_kj_per_mol).toBeNull();
    expect(unmatched.summary_flags).toBe('incomplete-reporting,no-matched-parent');
    const parentSummary = await summaryOf(parent.id);
    expect(parentSummary).toMatchObject({ summary_fold_change: 1, summary_ddg_kj_per_mol: 0, summary_measurement_count: 2 });
    const unmeasured = await summaryOf(d45n.id);
    expect(unmeasured).toMatchObject({ summary_measurement_count: 0, summary_fold_change: null, summary_flags: '' });
  });

  it('recompute every variant when the parent gains a measurement', async () => {
    await enter(parent.id, at37, [12, 0.5], [1.2e4, 500]);
    // Parent replicates 10⁴ and 1.2·10⁴, both ± 500: 1.1·10⁴ ± 500/√2.
    const parentCombined = 1.1e4;
    const parentSe = 500 / Math.SQRT2;
    const a = await summaryOf(s112a.id);
    expect(a.summary_ddg_kj_per_mol).toBeCloseTo(-rtKj(37.2) * Math.log(5 / parentCombined), 10);
    expect(a.summary_ddg_se_kj_per_mol).toBeCloseTo(rtKj(37.2) * Math.hypot(0.1, parentSe / parentCombined), 10);
    const b = await summaryOf(h190n.id);
    expect(b.summary_fold_change).toBeCloseTo(1040 / parentCombined, 12);
    expect((await summaryOf(d45e.id)).summary_ddg_kj_per_mol).toBeNull();
  });
});

describe('GET /api/campaigns/:id/cycles', () => {
  it('gives the coupling energy of the double mutant, checked by hand', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { body } = await viewer.agent.get(`/api/campaigns/${campaign.id}/cycles`).expect(200);
    expect(body.cycles).toHaveLength(1);
    const [cycle] = body.cycles;
    expect([cycle.combination.label, cycle.a.label, cycle.b.label]).toEqual(['S112A/H190N', 'S112A', 'H190N']);
    expect(cycle.temperatureC).toBe(37);
    // Parent (37 °C replicates) 1.1·10⁴ ± 353.55; A 5 ± 0.5; B 1040 ± 89.44; AB 2 ± 0.2.
    const parentValue = 1.1e4;
    const parentSe = 500 / Math.SQRT2;
    const bValue = 1040;
    const bSe = 89.44271909999159;
    const coupling = -rtKj(37) * Math.log((2 * parentValue) / (5 * bValue));
    const couplingSe = rtKj(37) * Math.hypot(0.1, parentSe / parentValue, 0.1, bSe / bValue);
    expect(cycle.kcatOverKm.coupling.kJPerMol.value).toBeCloseTo(coupling, 10);
    expect(cycle.kcatOverKm.coupling.kJPerMol.se).toBeCloseTo(couplingSe, 10);
    expect(cycle.kcatOverKm.coupling.kcalPerMol.value).toBeCloseTo(coupling / 4.184, 10);
    expect(cycle.kcatOverKm.ddgAB.value - cycle.kcatOverKm.predictedAdditive.value).toBeCloseTo(coupling, 10);
    expect(body.unmatched).toEqual([]);
  });

  it('answers 404 for an unknown campaign', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    await viewer.agent.get('/api/campaigns/999999/cycles').expect(404);
  });
});

describe('GET /api/campaigns/:id/landscape', () => {
  it('lays single mutants out by position and amino acid with catalytic positions marked', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { body } = await viewer.agent.get(`/api/campaigns/${campaign.id}/landscape`).expect(200);
    expect(body.aminoAcids).toEqual([...'ACDEFGHIKLMNPQRSTVWY', '*']);
    expect(body.positions).toEqual([
      { position: 45, parentResidue: 'D', catalyticRoles: ['general acid'] },
      { position: 112, parentResidue: 'S', catalyticRoles: ['nucleophile'] },
      { position: 190, parentResidue: 'H', catalyticRoles: ['general base'] },
    ]);
    const cell = (label: string) => body.cells.find((item: { label: string }) => item.label === label);
    expect(body.cells.map((item: { label: string }) => item.label)).toEqual(['D45E', 'D45N', 'S112A', 'H190N']);
    expect(cell('S112A')).toMatchObject({ position: 112, from: 'S', to: 'A', measurementCount: 1 });
    expect(cell('S112A').log10FoldChange).toBeCloseTo(Math.log10(5 / 1.1e4), 12);
    expect(cell('D45E')).toMatchObject({ foldChange: null, log10FoldChange: null, measurementCount: 1 });
    expect(cell('D45N')).toMatchObject({ measurementCount: 0, status: 'designed' });
    expect(body.counts).toEqual({ singleVariants: 4, measured: 3, withFoldChange: 2, positions: 3, catalyticPositions: 3 });
  });

  it('answers 404 for an unknown campaign', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    await viewer.agent.get('/api/campaigns/999999/landscape').expect(404);
  });
});

describe('role × route matrix for the comparison routes', () => {
  it.each(['viewer', 'biologist', 'kineticist', 'lead', 'admin'])('lets a %s read them', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.get(`/api/variants/${s112a.id}/comparison`).expect(200);
    await session.agent.get(`/api/campaigns/${campaign.id}/cycles`).expect(200);
    await session.agent.get(`/api/campaigns/${campaign.id}/landscape`).expect(200);
  });

  it('returns 401 when signed out, and leaves other /api routes alone', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    await session.agent.post('/api/auth/sign-out').set('X-CSRF-Token', session.csrfToken).expect(204);
    await session.agent.get(`/api/variants/${s112a.id}/comparison`).expect(401);
    await session.agent.get(`/api/campaigns/${campaign.id}/landscape`).expect(401);
    // The root-mounted router guards only its own paths: health stays public.
    await session.agent.get('/api/health').expect(200);
  });
});
