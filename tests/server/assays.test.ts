import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Campaign } from '@server/modules/campaigns/campaign.entity';
import type { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, inventedSequence } from '../factories';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

/** |actual/expected − 1| ≤ tolerance: the "within 1e-6 relative" of the reference comparison. */
function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(tolerance);
}

let testApp: TestApp;
let campaign: Campaign;
let variant: Variant;

// Puromycin, treated cells (Treloar 1974; Bates & Watts, Nonlinear Regression Analysis and Its Applications,
// 1988), as printed by R's nls: Vm = 212.6837431425 (SE 6.947), K = 0.06412128168 (SE 0.008281), residual
// SE 10.93 on 10 df. Entered here as mM and µM/min with [E]t = 10 nM; 1 mM = 10⁻³ M and
// 1 µM/min = 10⁻⁶/60 M s⁻¹ (SI Brochure, 9th ed.).
const S_MM = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const V_UM_PER_MIN = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const VM = 212.6837431425;
const K = 0.06412128168;
const KCAT_PER_SECOND = VM / 0.01 / 60;

function puromycinAssay(variantId: number, extra: Record<string, unknown> = {}) {
  return {
    variantId,
    substrate: 'pNP-acetate',
    temperatureC: 37,
    ph: 6,
    buffer: { name: 'MES', concentration: { value: 50, unit: 'mM' } },
    metal: { salt: 'ZnCl2', concentration: { value: 10, unit: 'µM' } },
    enzymeConcentration: { value: 10, unit: 'nM' },
    method: 'continuous',
    detection: 'absorbance 405 nm',
    assayDate: '2026-03-02',
    points: S_MM.map((s, index) => ({ s, v: V_UM_PER_MIN[index], replicate: (index % 2) + 1 })),
    sUnit: 'mM',
    vUnit: 'µM/min',
    model: 'michaelis-menten',
    ...extra,
  };
}

async function tableCounts() {
  const count = async (table: string) => ((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM ${table}`)) as { n: number }[])[0].n;
  return {
    assays: await count('assays'),
    points: await count('rate_points'),
    measurements: await count('measurements'),
    audit: await count('audit_events'),
  };
}

beforeAll(async () => {
  testApp = await createTestApp();
  const sequence = inventedSequence(300, { 112: 'S', 190: 'H' });
  const enzyme = await createEnzymeRow(testApp.dataSource, { sequence, cofactors: ['Zn2+'] });
  ({ campaign } = await createCampaignWithParent(testApp.dataSource, { enzyme }));
  variant = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 112, from: 'S', to: 'A' }] });
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('POST /api/assays', () => {
  it('fits the points on save, in SI units, matching the reference fit', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const response = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    const { assay, measurement } = response.body;
    expect(measurement.source).toBe('fitted');
    expect(measurement.reviewState).toBe('draft');
    expect(measurement.kcat.unit).toBe('s⁻¹');
    expectRelative(measurement.kcat.value, KCAT_PER_SECOND, 1e-6);
    expect(measurement.km.unit).toBe('M');
    expectRelative(measurement.km.value, (K * 1e-3), 1e-6);
    expectRelative(measurement.km.se, (0.008281 * 1e-3), 1e-3);
    expectRelative(measurement.vmax.value, ((VM * 1e-6) / 60), 1e-6);
    expect(measurement.kcatOverKm.unit).toBe('M⁻¹ s⁻¹');
    expectRelative(measurement.kcatOverKm.value, (KCAT_PER_SECOND / (K * 1e-3)), 1e-6);
    expectRelative(measurement.residualSd.value, ((10.93 * 1e-6) / 60), 1e-3);
    expect(measurement.degreesOfFreedom).toBe(10);
    expect(measurement.kcat.ci95[0]).toBeLessThan(measurement.kcat.value);
    expect(measurement.substrateRange).toEqual({ min: expect.closeTo(2e-5, 18), max: expect.closeTo(1.1e-3, 15), unit: 'M' });
    expect(measurement.replicateCount).toBe(2);
    // Every STRENDA item this assay reports is present.
    expect(measurement.completeness).toEqual({ score: 1, missing: [] });
    // Km (0.064 mM) lies below the lowest concentration's fifth (0.02 mM > 0.2 × Km = 0.0128 mM): flagged.
    expect(measurement.flags.map((flag: { code: string }) => flag.code)).toContain('range-does-not-span-km');
    expect(assay.conditions).toMatchObject({
      temperatureC: 37,
      ph: 6,
      buffer: { name: 'MES', concentration: { value: 0.05, unit: 'M' } },
      metal: { salt: 'ZnCl2', concentration: { value: expect.closeTo(1e-5, 18), unit: 'M' } },
      enzymeConcentration: { value: expect.closeTo(1e-8, 20), unit: 'M', entered: { value: expect.closeTo(10, 9), unit: 'nM' } },
    });
    expect(assay.points).toHaveLength(12);
    expect(assay.points[0]).toMatchObject({ s: expect.closeTo(0.02, 12), v: expect.closeTo(76, 9), substrateMolar: 2e-5 });
    expect(assay.points[0].rateMolarPerSecond).toBeCloseTo((76e-6) / 60, 18);
  });

  it('keeps excluded points stored but out of the fit', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const body = puromycinAssay(variant.id);
    body.points.push({ s: 0.3, v: 900, replicate: 1, excluded: true, exclusionReason: 'bubble in the well' } as (typeof body.points)[number]);
    const { body: created } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(body).expect(201);
    expect(created.assay.points).toHaveLength(13);
    expect(created.assay.points[12]).toMatchObject({ excluded: true, exclusionReason: 'bubble in the well' });
    expect(created.measurement.pointCount).toBe(12);
    expectRelative(created.measurement.kcat.value, KCAT_PER_SECOND, 1e-6);
  });

  it('records audit events for the assay and its measurement and updates the variant summary', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const before = await tableCounts();
    const { body } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    const events = (await testApp.dataSource.query(
      `SELECT entity_type, entity_id, action, campaign_id FROM audit_events WHERE id > (SELECT MAX(id) - 2 FROM audit_events) ORDER BY id`,
    )) as { entity_type: string; entity_id: number; action: string; campaign_id: number }[];
    expect(events).toEqual([
      { entity_type: 'assay', entity_id: body.assay.id, action: 'create', campaign_id: campaign.id },
      { entity_type: 'measurement', entity_id: body.measurement.id, action: 'create', campaign_id: campaign.id },
    ]);
    expect((await tableCounts()).audit).toBe(before.audit + 2);
    const [summary] = (await testApp.dataSource.query(`SELECT summary_measurement_count, summary_kcat FROM variants WHERE id = ?`, [variant.id])) as {
      summary_measurement_count: number;
      summary_kcat: number;
    }[];
    expect(summary.summary_measurement_count).toBe(3);
    expectRelative(summary.summary_kcat, KCAT_PER_SECOND, 1e-6);
  });

  it('returns 400 with field messages for bad input and writes nothing', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const before = await tableCounts();
    const response = await session.agent
      .post('/api/assays')
      .set('X-CSRF-Token', session.csrfToken)
      .send(puromycinAssay(variant.id, { temperatureC: 'warm', ph: -1, sUnit: 'ppm', points: [{ s: -0.1, v: 3 }] }))
      .expect(400);
    expect(response.body.error.code).toBe('validation_error');
    expect(response.body.error.fields).toMatchObject({
      temperatureC: 'must be a finite number',
      ph: 'must be between 0 and 14',
      sUnit: 'must be one of M, mM, µM, uM, μM, nM',
      'points.0.s': 'must be at least 0',
    });
    expect(await tableCounts()).toEqual(before);
  });

  it('returns 400 for an unknown variant and for points the model cannot describe, writing nothing', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const before = await tableCounts();
    const unknown = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(99999)).expect(400);
    expect(unknown.body.error.fields).toEqual({ variantId: 'no variant with id 99999' });
    // Rates falling with [S]: the best Michaelis–Menten curve has a negative Km.
    const falling = [1, 2, 3, 4, 5, 6].map((s) => ({ s, v: 10 - s }));
    const refused = await session.agent
      .post('/api/assays')
      .set('X-CSRF-Token', session.csrfToken)
      .send(puromycinAssay(variant.id, { points: falling }))
      .expect(400);
    expect(refused.body.error.fields.points).toMatch(/non-positive/);
    expect(await tableCounts()).toEqual(before);
  });
});

describe('POST /api/assays size limit', () => {
  it('takes 10,000 points and refuses 10,001', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    // Michaelis–Menten rates (Vmax 200 µM/min, Km 0.5 mM) with a small deterministic ripple.
    const points = Array.from({ length: 10_000 }, (_, index) => {
      const s = 0.01 + (index % 500) * 0.01;
      return { s, v: (200 * s) / (0.5 + s) + Math.sin(index) };
    });
    const created = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id, { points })).expect(201);
    expect(created.body.measurement.pointCount).toBe(10_000);
    expect(created.body.measurement.km.value).toBeCloseTo(5e-4, 5);
    const tooMany = await session.agent
      .post('/api/assays')
      .set('X-CSRF-Token', session.csrfToken)
      .send(puromycinAssay(variant.id, { points: [...points, { s: 1, v: 1 }] }))
      .expect(400);
    expect(tooMany.body.error.fields).toEqual({ points: 'must have at most 10000 points' });
  });
});

describe('GET /api/assays', () => {
  it('lists a variant’s assays and returns one with points and measurements', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    const list = await session.agent.get(`/api/assays?variantId=${variant.id}`).expect(200);
    expect(list.body.total).toBeGreaterThanOrEqual(3);
    expect(list.body.items[0]).not.toHaveProperty('points');
    expect(list.body.items[0].measurements[0].variant).toEqual({ id: variant.id, label: 'S112A', campaignId: campaign.id });
    const one = await session.agent.get(`/api/assays/${list.body.items[0].id}`).expect(200);
    expect(one.body.assay.points.length).toBeGreaterThan(0);
    expect(one.body.assay.currentMeasurementId).toBe(one.body.assay.measurements[0].id);
  });

  it('answers 404 for a missing assay and 400 for a bad id or query', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    await session.agent.get('/api/assays/99999').expect(404);
    await session.agent.get('/api/assays/abc').expect(400);
    const bad = await session.agent.get('/api/assays?variantId=x&pageSize=9999').expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['pageSize', 'variantId']);
  });
});

describe('POST /api/assays/:id/refit', () => {
  it('creates a new measurement, supersedes the old one and refuses a stale version', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const { body: created } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    const firstPoint = created.assay.points[0];
    const countedBefore = ((await testApp.dataSource.query(`SELECT summary_measurement_count AS n FROM variants WHERE id = ?`, [variant.id])) as { n: number }[])[0].n;
    const refit = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, points: [{ id: firstPoint.id, excluded: true, exclusionReason: 'pipetting error' }] })
      .expect(201);
    expect(refit.body.measurement.id).not.toBe(created.measurement.id);
    expect(refit.body.measurement.pointCount).toBe(11);
    expect(refit.body.measurement.reviewState).toBe('draft');
    expect(refit.body.assay.version).toBe(created.assay.version + 1);
    expect(refit.body.assay.currentMeasurementId).toBe(refit.body.measurement.id);
    const old = refit.body.assay.measurements.find((item: { id: number }) => item.id === created.measurement.id);
    expect(old).toMatchObject({ supersededById: refit.body.measurement.id, counts: false });
    expect(refit.body.assay.points[0]).toMatchObject({ excluded: true, exclusionReason: 'pipetting error' });
    // The refit replaces the superseded measurement in the counts; it does not add one.
    const countedAfter = ((await testApp.dataSource.query(`SELECT summary_measurement_count AS n FROM variants WHERE id = ?`, [variant.id])) as { n: number }[])[0].n;
    expect(countedAfter).toBe(countedBefore);
    // The fit without the first point differs from the full fit.
    expect(refit.body.measurement.kcat.value).not.toBeCloseTo(created.measurement.kcat.value, 3);

    const events = (await testApp.dataSource.query(
      `SELECT entity_type, action FROM audit_events WHERE entity_id IN (?, ?, ?) AND entity_type IN ('assay', 'measurement') AND action IN ('refit', 'supersede') ORDER BY id`,
      [created.assay.id, created.measurement.id, refit.body.measurement.id],
    )) as { entity_type: string; action: string }[];
    expect(events).toEqual([
      { entity_type: 'measurement', action: 'supersede' },
      { entity_type: 'assay', action: 'refit' },
    ]);

    const before = await tableCounts();
    const stale = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, model: 'hill' })
      .expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(await tableCounts()).toEqual(before);
  });

  it('refits with another model, and refuses one the data do not support', async () => {
    const session = await signedIn(testApp.app, demoEmail('lead'));
    const { body: created } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    // The Puromycin rates show no substrate inhibition, so the best 1/Ki is below zero and Ki negative.
    const refused = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, model: 'substrate-inhibition' })
      .expect(400);
    expect(refused.body.error.fields.points).toMatch(/^the substrate inhibition fit gives a non-positive ki/);
    const refit = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, model: 'hill' })
      .expect(201);
    expect(refit.body.measurement.model).toBe('hill');
    expect(refit.body.measurement.hill.unit).toBe('');
    // kcat/K½ is no second-order rate constant, so a Hill fit stores none.
    expect(refit.body.measurement.kcatOverKm).toBeNull();
  });

  it('refuses point ids of another assay (400) and an assay without points (409)', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const { body: created } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    const foreign = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, points: [{ id: 999999, excluded: true, exclusionReason: 'x' }] })
      .expect(400);
    expect(foreign.body.error.fields).toEqual({ 'points.0.id': `is not a point of assay ${created.assay.id}` });

    const entered = await session.agent
      .post('/api/measurements')
      .set('X-CSRF-Token', session.csrfToken)
      .send({
        variantId: variant.id,
        substrate: 'pNP-acetate',
        temperatureC: 37,
        ph: 6,
        assayDate: '2026-03-03',
        kcat: { value: 5, se: 0.5, unit: '1/s' },
        km: { value: 0.5, se: 0.05, unit: 'mM' },
      })
      .expect(201);
    const noPoints = await session.agent
      .post(`/api/assays/${entered.body.measurement.assayId}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: 1, model: 'hill' })
      .expect(409);
    expect(noPoints.body.error.message).toMatch(/no rate points/);
  });

  it('refuses exclusions that leave too few points (400)', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const { body: created } = await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
    const exclusions = created.assay.points.slice(0, 10).map((point: { id: number }) => ({ id: point.id, excluded: true, exclusionReason: 'test' }));
    const response = await session.agent
      .post(`/api/assays/${created.assay.id}/refit`)
      .set('X-CSRF-Token', session.csrfToken)
      .send({ version: created.assay.version, points: exclusions })
      .expect(400);
    expect(response.body.error.fields.points).toBe('fitMichaelisMenten requires at least three points with distinct substrate concentrations');
    const points = (await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM rate_points WHERE assay_id = ? AND excluded = 1`, [created.assay.id])) as {
      n: number;
    }[];
    expect(points[0].n).toBe(0);
  });
});

describe('role × route matrix for /api/assays', () => {
  it.each(['viewer', 'biologist'])('returns 403 for a %s on every write', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(403);
    await session.agent.post('/api/assays/1/refit').set('X-CSRF-Token', session.csrfToken).send({ version: 1, model: 'hill' }).expect(403);
    await session.agent.get(`/api/assays?variantId=${variant.id}`).expect(200);
  });

  it.each(['kineticist', 'lead', 'admin'])('lets a %s create an assay', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.post('/api/assays').set('X-CSRF-Token', session.csrfToken).send(puromycinAssay(variant.id)).expect(201);
  });

  it('returns 401 when signed out', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    await session.agent.post('/api/auth/sign-out').set('X-CSRF-Token', session.csrfToken).expect(204);
    await session.agent.get('/api/assays').expect(401);
  });
});
