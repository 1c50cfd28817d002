import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, inventedSequence } from '../factories';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

let testApp: TestApp;
let variant: Variant;

// A noise-free bell profile, k = kmax/(1 + 10^(pKa1 − pH) + 10^(pH − pKa2)), with pKa1 = 4.2, pKa2 = 8.4 at
// pH 3.0, 3.5, …, 10.0; the optimum (pKa1 + pKa2)/2 = 6.3 follows from the model's algebra (Dixon,
// Biochem. J. 55 (1953) 161). Free side-chain pKa values: Dawson et al., Data for Biochemical Research,
// 3rd ed. (1986): Asp 3.90, Glu 4.07, His 6.04.
const PH = Array.from({ length: 15 }, (_, index) => 3 + index / 2);
const bell = (kmax: number, pKa1: number, pKa2: number) => PH.map((ph) => ({ ph, k: kmax / (1 + 10 ** (pKa1 - ph) + 10 ** (ph - pKa2)) }));

function profileBody(extra: Record<string, unknown> = {}) {
  return {
    variantId: variant.id,
    substrate: 'pNP-acetate',
    temperatureC: 37,
    rateKind: 'kcatOverKm',
    unit: 'mM⁻¹ s⁻¹',
    model: 'bell',
    points: bell(50, 4.2, 8.4),
    ...extra,
  };
}

beforeAll(async () => {
  testApp = await createTestApp();
  const sequence = inventedSequence(300, { 45: 'D', 112: 'S', 190: 'H', 200: 'E' });
  const enzyme = await createEnzymeRow(testApp.dataSource, {
    sequence,
    sites: [
      { position: 45, residue: 'D', role: 'general acid', expectedPka: 4.5 },
      { position: 112, residue: 'S', role: 'nucleophile' },
      { position: 190, residue: 'H', role: 'general base' },
      { position: 190, residue: 'H', role: 'acid/base' },
      { position: 200, residue: 'E', role: 'electrostatic' },
    ],
  });
  const { campaign } = await createCampaignWithParent(testApp.dataSource, { enzyme });
  variant = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 112, from: 'S', to: 'C' }] });
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('POST /api/ph-profiles', () => {
  it('fits a bell profile, stores SI rates and the pH optimum, and reads the pKa values against the sites', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const { profile } = (await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody()).expect(201)).body;
    expect(profile.pKa1.value).toBeCloseTo(4.2, 6);
    expect(profile.pKa2.value).toBeCloseTo(8.4, 6);
    expect(profile.phOptimum.value).toBeCloseTo(6.3, 6);
    // 50 mM⁻¹ s⁻¹ = 5·10⁴ M⁻¹ s⁻¹.
    expect(profile.kMax.unit).toBe('M⁻¹ s⁻¹');
    expect(profile.kMax.value).toBeCloseTo(5e4, 3);
    expect(profile.points[0].k).toBeCloseTo(bell(5e4, 4.2, 8.4)[0].k, 6);

    const [acidic, basic] = profile.pkaReading;
    expect(acidic.parameter).toBe('pKa1');
    // Candidates by the size of the shift: Glu 4.07 (+0.13), Asp 3.90 (+0.30), His 6.04 (−1.84); Ser is not ionizable.
    expect(acidic.candidates.map((candidate: { residue: string; position: number }) => `${candidate.residue}${candidate.position}`)).toEqual([
      'E200',
      'D45',
      'H190',
    ]);
    expect(acidic.candidates[0].freePka).toBe(4.07);
    expect(acidic.candidates[0].shift).toBeCloseTo(0.13, 6);
    expect(acidic.candidates[1]).toMatchObject({ roles: ['general acid'], expectedPka: 4.5, freePka: 3.9 });
    expect(acidic.candidates[1].shift).toBeCloseTo(0.3, 6);
    // pKa2 8.4: His +2.36 first; both roles of His190 are kept.
    expect(basic.parameter).toBe('pKa2');
    expect(basic.candidates[0]).toMatchObject({ position: 190, residue: 'H', roles: ['acid/base', 'general base'], freePka: 6.04 });
    expect(basic.candidates[0].shift).toBeCloseTo(2.36, 6);

    const [row] = (await testApp.dataSource.query(`SELECT summary_ph_optimum FROM variants WHERE id = ?`, [variant.id])) as {
      summary_ph_optimum: number;
    }[];
    expect(row.summary_ph_optimum).toBeCloseTo(6.3, 6);

    const audit = (await testApp.dataSource.query(`SELECT action FROM audit_events WHERE entity_type = 'ph-profile' AND entity_id = ?`, [profile.id])) as {
      action: string;
    }[];
    expect(audit).toEqual([{ action: 'create' }]);
  });

  it('stores the single limb pKa as pKa1 (acid) or pKa2 (base), and converts kcat units', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    // Acid limb k = kmax/(1 + 10^(pKa − pH)), pKa 5.1, kmax 600 min⁻¹ = 10 s⁻¹.
    const acid = PH.map((ph) => ({ ph, k: 600 / (1 + 10 ** (5.1 - ph)) }));
    const { profile } = (
      await session.agent
        .post('/api/ph-profiles')
        .set('X-CSRF-Token', session.csrfToken)
        .send(profileBody({ rateKind: 'kcat', unit: '1/min', model: 'acid', points: acid }))
        .expect(201)
    ).body;
    expect(profile.pKa1.value).toBeCloseTo(5.1, 6);
    expect(profile.pKa2).toBeNull();
    expect(profile.phOptimum).toBeNull();
    expect(profile.kMax).toMatchObject({ unit: 's⁻¹' });
    expect(profile.kMax.value).toBeCloseTo(10, 6);
    const base = PH.map((ph) => ({ ph, k: 3 / (1 + 10 ** (ph - 7.7)) }));
    const baseProfile = (
      await session.agent
        .post('/api/ph-profiles')
        .set('X-CSRF-Token', session.csrfToken)
        .send(profileBody({ rateKind: 'v0', unit: 'µM/min', model: 'base', points: base }))
        .expect(201)
    ).body.profile;
    expect(baseProfile.pKa1).toBeNull();
    expect(baseProfile.pKa2.value).toBeCloseTo(7.7, 6);
    expect(baseProfile.kMax.value).toBeCloseTo(3e-6 / 60, 12);
  });

  it('leaves excluded points out of the fit', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const points = [...bell(50, 4.2, 8.4), { ph: 6.25, k: 500, excluded: true }];
    const { profile } = (await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody({ points })).expect(201)).body;
    expect(profile.points).toHaveLength(16);
    expect(profile.points[15]).toMatchObject({ ph: 6.25, excluded: true });
    expect(profile.pKa1.value).toBeCloseTo(4.2, 6);
  });

  it('returns 400 with field messages for bad input and writes nothing', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const count = async () => ((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM ph_profiles`)) as { n: number }[])[0].n;
    const before = await count();
    const wrongUnit = await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody({ rateKind: 'kcat', unit: 'µM/min' })).expect(400);
    expect(wrongUnit.body.error.fields).toEqual({ unit: 'must be a kcat unit such as 1/s, s⁻¹, 1/min' });
    const tooFew = await session.agent
      .post('/api/ph-profiles')
      .set('X-CSRF-Token', session.csrfToken)
      .send(profileBody({ points: [{ ph: 4, k: 1 }, { ph: 5, k: 2 }, { ph: 6, k: 2 }, { ph: 7, k: 1, excluded: true }] }))
      .expect(400);
    expect(tooFew.body.error.fields).toEqual({ points: 'must contain at least four included points with distinct pH values' });
    const outOfRange = await session.agent
      .post('/api/ph-profiles')
      .set('X-CSRF-Token', session.csrfToken)
      .send(profileBody({ points: [{ ph: 15, k: -1 }], model: 'ring' }))
      .expect(400);
    expect(outOfRange.body.error.fields).toMatchObject({ 'points.0.ph': 'must be between 0 and 14', 'points.0.k': 'must be at least 0', model: "must be one of bell, acid, base" });
    await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody({ variantId: 987654 })).expect(400);
    expect(await count()).toBe(before);
  });
});

describe('GET /api/ph-profiles', () => {
  it('lists a variant’s profiles and returns one with its pKa reading', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { items } = (await viewer.agent.get(`/api/ph-profiles?variantId=${variant.id}`).expect(200)).body;
    expect(items.length).toBeGreaterThanOrEqual(4);
    expect(items[0]).not.toHaveProperty('pkaReading');
    const { profile } = (await viewer.agent.get(`/api/ph-profiles/${items[0].id}`).expect(200)).body;
    expect(profile.pkaReading.length).toBeGreaterThan(0);
    await viewer.agent.get('/api/ph-profiles/999999').expect(404);
    const bad = await viewer.agent.get('/api/ph-profiles').expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['variantId']);
  });
});

describe('role × route matrix for /api/ph-profiles', () => {
  it.each(['viewer', 'biologist'])('returns 403 for a %s on POST', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody()).expect(403);
  });

  it.each(['kineticist', 'lead', 'admin'])('lets a %s create one', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.post('/api/ph-profiles').set('X-CSRF-Token', session.csrfToken).send(profileBody()).expect(201);
  });
});
