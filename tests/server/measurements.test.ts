import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Campaign } from '@server/modules/campaigns/campaign.entity';
import type { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow } from '../factories';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

let testApp: TestApp;
let campaign: Campaign;
let variant: Variant;

beforeAll(async () => {
  testApp = await createTestApp();
  const enzyme = await createEnzymeRow(testApp.dataSource);
  ({ campaign } = await createCampaignWithParent(testApp.dataSource, { enzyme }));
  variant = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 12, from: 'G', to: 'A' }] });
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

// Invented reported values; the unit factors are the SI ones (1 min = 60 s, 1 mM = 10⁻³ M; SI Brochure, 9th ed.).
function enteredBody(extra: Record<string, unknown> = {}) {
  return {
    variantId: variant.id,
    substrate: 'pNP-acetate',
    temperatureC: 37,
    ph: 6,
    buffer: { name: 'MES', concentration: { value: 50, unit: 'mM' } },
    assayDate: '2026-03-04',
    kcat: { value: 600, se: 30, unit: '1/min' },
    km: { value: 1, se: 0.1, unit: 'mM' },
    ...extra,
  };
}

type Session = Awaited<ReturnType<typeof signedIn>>;

async function enter(session: Session, extra: Record<string, unknown> = {}) {
  const response = await session.agent.post('/api/measurements').set('X-CSRF-Token', session.csrfToken).send(enteredBody(extra)).expect(201);
  return response.body.measurement as { id: number; version: number; reviewState: string };
}

function review(session: Session, id: number, body: Record<string, unknown>) {
  return session.agent.post(`/api/measurements/${id}/review`).set('X-CSRF-Token', session.csrfToken).send(body);
}

async function stateOf(id: number): Promise<{ review_state: string; version: number }> {
  const [row] = (await testApp.dataSource.query(`SELECT review_state, version FROM measurements WHERE id = ?`, [id])) as {
    review_state: string;
    version: number;
  }[];
  return row;
}

describe('POST /api/measurements', () => {
  it('stores reported values in SI, derives kcat/Km with a warning and scores completeness', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const response = await session.agent.post('/api/measurements').set('X-CSRF-Token', session.csrfToken).send(enteredBody()).expect(201);
    const { measurement } = response.body;
    expect(measurement.source).toBe('entered');
    // 600 min⁻¹ = 10 s⁻¹; 1 mM = 10⁻³ M; kcat/Km = 10⁴ M⁻¹ s⁻¹ with relative error √(0.05² + 0.1²).
    expect(measurement.kcat).toEqual({ value: 10, se: 0.5, ci95: null, unit: 's⁻¹' });
    expect(measurement.km).toEqual({ value: 0.001, se: 0.0001, ci95: null, unit: 'M' });
    expect(measurement.kcatOverKm.value).toBeCloseTo(1e4, 8);
    expect(measurement.kcatOverKm.se).toBeCloseTo(1e4 * Math.sqrt(0.05 ** 2 + 0.1 ** 2), 8);
    expect(measurement.warnings[0]).toMatch(/derived from kcat and Km/);
    expect(measurement.completeness.missing).toEqual([
      'substrate concentration range',
      'enzyme concentration',
      'number of replicates',
      'kinetic model and fitting method',
    ]);
    expect(measurement.completeness.score).toBeCloseTo(8 / 12, 12);
    expect(measurement.replicateCount).toBeNull();
    expect(measurement.conditions.temperatureC).toBe(37);
    const [assay] = (await testApp.dataSource.query(`SELECT s_unit, temperature_k FROM assays WHERE id = ?`, [measurement.assayId])) as {
      s_unit: string | null;
      temperature_k: number;
    }[];
    expect(assay).toEqual({ s_unit: null, temperature_k: 310.15 });
  });

  it('takes kcat/Km when it is reported and flags an implausible value', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const measurement = (
      await session.agent
        .post('/api/measurements')
        .set('X-CSRF-Token', session.csrfToken)
        .send(enteredBody({ kcatOverKm: { value: 2e7, se: 1e6, unit: 'mM⁻¹ s⁻¹' }, substrateRange: { min: 0.1, max: 10, unit: 'mM' }, replicateCount: 3 }))
        .expect(201)
    ).body.measurement;
    // 2·10⁷ mM⁻¹ s⁻¹ = 2·10¹⁰ M⁻¹ s⁻¹, above the 10¹⁰ diffusion ceiling (Alberty & Hammes 1958).
    expect(measurement.kcatOverKm.value).toBe(2e10);
    expect(measurement.flags.map((flag: { code: string }) => flag.code)).toContain('above-diffusion-limit');
    expect(measurement.substrateRange).toEqual({ min: 1e-4, max: 0.01, unit: 'M' });
    expect(measurement.replicateCount).toBe(3);
  });

  it('returns 400 with field messages and writes nothing', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const count = async () => ((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM measurements`)) as { n: number }[])[0].n;
    const before = await count();
    const response = await session.agent
      .post('/api/measurements')
      .set('X-CSRF-Token', session.csrfToken)
      .send(enteredBody({ kcat: { value: -1, se: 1, unit: '1/s' }, km: { value: 1, se: 0.1, unit: 'mM' }, assayDate: 'yesterday' }))
      .expect(400);
    expect(response.body.error.fields).toEqual({ 'kcat.value': 'must be greater than 0', assayDate: 'must be a date written YYYY-MM-DD' });
    await session.agent.post('/api/measurements').set('X-CSRF-Token', session.csrfToken).send(enteredBody({ variantId: 424242 })).expect(400);
    expect(await count()).toBe(before);
  });
});

describe('review state machine', () => {
  it('runs draft → submitted → approved → flagged → approved → retracted with audit events', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const created = await enter(kineticist);

    const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
    expect(submitted).toMatchObject({ reviewState: 'submitted', version: created.version + 1 });

    const approved = (await review(lead, created.id, { version: submitted.version, action: 'approve' }).expect(200)).body.measurement;
    expect(approved.reviewState).toBe('approved');
    expect(approved.reviewedAt).not.toBeNull();

    const missingReason = await review(lead, created.id, { version: approved.version, action: 'flag' }).expect(400);
    expect(missingReason.body.error.fields).toEqual({ reason: 'is required to flag a measurement' });

    const flagged = (await review(lead, created.id, { version: approved.version, action: 'flag', reason: 'enzyme stock was six months old' }).expect(200))
      .body.measurement;
    expect(flagged).toMatchObject({ reviewState: 'flagged', reviewReason: 'enzyme stock was six months old', counts: false });

    const cleared = (await review(lead, created.id, { version: flagged.version, action: 'approve' }).expect(200)).body.measurement;
    const retracted = (await review(kineticist, created.id, { version: cleared.version, action: 'retract', reason: 'wrong variant loaded' }).expect(200))
      .body.measurement;
    expect(retracted).toMatchObject({ reviewState: 'retracted', reviewReason: 'wrong variant loaded', counts: false });

    // Retracted is final, and the row is kept.
    const final = await review(lead, created.id, { version: retracted.version, action: 'approve' }).expect(409);
    expect(final.body.error).toMatchObject({ code: 'invalid_transition', currentState: 'retracted' });
    expect(final.body.error.message).toBe(`Measurement ${created.id} is retracted; only submitted or flagged measurements can be approved.`);

    const events = (await testApp.dataSource.query(
      `SELECT action, before, after FROM audit_events WHERE entity_type = 'measurement' AND entity_id = ? ORDER BY id`,
      [created.id],
    )) as { action: string; before: string | null; after: string }[];
    expect(events.map((event) => event.action)).toEqual(['create', 'submit', 'approve', 'flag', 'approve', 'retract']);
    expect(JSON.parse(events[3].before!).reviewState).toBe('approved');
    expect(JSON.parse(events[3].after).reviewState).toBe('flagged');
  });

  it('answers 409 naming the current state for a transition the machine does not allow', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const created = await enter(kineticist);
    const approveDraft = await review(lead, created.id, { version: created.version, action: 'approve' }).expect(409);
    expect(approveDraft.body.error.message).toBe(`Measurement ${created.id} is draft; only submitted or flagged measurements can be approved.`);
    const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
    const again = await review(kineticist, created.id, { version: submitted.version, action: 'submit' }).expect(409);
    expect(again.body.error.message).toBe(`Measurement ${created.id} is submitted; only draft measurements can be submitted.`);
    const noReason = await review(kineticist, created.id, { version: submitted.version, action: 'retract' }).expect(400);
    expect(noReason.body.error.fields).toEqual({ reason: 'is required to retract a measurement' });
  });

  it('answers 409 stale_version for an old version and changes nothing', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const created = await enter(kineticist);
    await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200);
    const stale = await review(kineticist, created.id, { version: created.version, action: 'retract', reason: 'duplicate' }).expect(409);
    expect(stale.body.error).toMatchObject({ code: 'stale_version', currentVersion: created.version + 1 });
    expect(await stateOf(created.id)).toEqual({ review_state: 'submitted', version: created.version + 1 });
  });

  it('answers 404 for an unknown measurement and 400 for a bad action', async () => {
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    await review(lead, 999999, { version: 1, action: 'submit' }).expect(404);
    const bad = await review(lead, 1, { version: 1, action: 'publish' }).expect(400);
    expect(bad.body.error.fields).toEqual({ action: 'must be one of submit, approve, flag, retract' });
  });
});

describe('POST /api/measurements/review (bulk)', () => {
  it('approves several at once', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const items = [];
    for (let index = 0; index < 3; index += 1) {
      const created = await enter(kineticist);
      const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
      items.push({ id: submitted.id, version: submitted.version });
    }
    const response = await lead.agent.post('/api/measurements/review').set('X-CSRF-Token', lead.csrfToken).send({ items, action: 'approve' }).expect(200);
    expect(response.body.items.map((item: { reviewState: string }) => item.reviewState)).toEqual(['approved', 'approved', 'approved']);
  });

  it('rolls everything back when one item is stale', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const items = [];
    for (let index = 0; index < 3; index += 1) {
      const created = await enter(kineticist);
      const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
      items.push({ id: submitted.id, version: submitted.version });
    }
    const auditBefore = ((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM audit_events`)) as { n: number }[])[0].n;
    const stale = [items[0], items[1], { id: items[2].id, version: items[2].version - 1 }];
    const response = await lead.agent
      .post('/api/measurements/review')
      .set('X-CSRF-Token', lead.csrfToken)
      .send({ items: stale, action: 'flag', reason: 'plate reader out of calibration' })
      .expect(409);
    expect(response.body.error).toMatchObject({ code: 'stale_version', id: items[2].id, fields: { 'items.2.version': 'is stale' } });
    for (const item of items) expect(await stateOf(item.id)).toEqual({ review_state: 'submitted', version: item.version });
    expect(((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM audit_events`)) as { n: number }[])[0].n).toBe(auditBefore);
  });

  it('rolls back when one transition is invalid, and refuses duplicates', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const draft = await enter(kineticist);
    const other = await enter(kineticist);
    const submitted = (await review(kineticist, other.id, { version: other.version, action: 'submit' }).expect(200)).body.measurement;
    const response = await lead.agent
      .post('/api/measurements/review')
      .set('X-CSRF-Token', lead.csrfToken)
      .send({ items: [{ id: submitted.id, version: submitted.version }, { id: draft.id, version: draft.version }], action: 'approve' })
      .expect(409);
    expect(response.body.error.message).toMatch(/is draft; only submitted or flagged measurements can be approved \(item 2\); nothing was changed\./);
    expect((await stateOf(submitted.id)).review_state).toBe('submitted');
    const duplicate = await lead.agent
      .post('/api/measurements/review')
      .set('X-CSRF-Token', lead.csrfToken)
      .send({ items: [{ id: draft.id, version: 1 }, { id: draft.id, version: 1 }], action: 'submit' })
      .expect(400);
    expect(duplicate.body.error.fields).toEqual({ 'items.1.id': `lists measurement ${draft.id} twice` });
  });
});

describe('GET /api/measurements', () => {
  it('filters by campaign, variant and review state, with paging', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const all = (await viewer.agent.get(`/api/measurements?campaignId=${campaign.id}&pageSize=500`).expect(200)).body;
    expect(all.total).toBeGreaterThan(5);
    const submitted = (await viewer.agent.get(`/api/measurements?variantId=${variant.id}&reviewState=submitted`).expect(200)).body;
    expect(submitted.items.length).toBeGreaterThan(0);
    expect(submitted.items.every((item: { reviewState: string }) => item.reviewState === 'submitted')).toBe(true);
    const page = (await viewer.agent.get(`/api/measurements?campaignId=${campaign.id}&page=2&pageSize=2`).expect(200)).body;
    expect(page).toMatchObject({ page: 2, pageSize: 2, total: all.total });
    expect(page.items.map((item: { id: number }) => item.id)).toEqual(all.items.slice(2, 4).map((item: { id: number }) => item.id));
    const none = (await viewer.agent.get(`/api/measurements?campaignId=999999`).expect(200)).body;
    expect(none).toMatchObject({ total: 0, items: [] });
    const bad = await viewer.agent.get('/api/measurements?reviewState=pending').expect(400);
    expect(bad.body.error.fields).toEqual({ reviewState: 'must list review states among draft, submitted, approved, flagged, retracted' });
  });

  it('returns one measurement, or 404', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { items } = (await viewer.agent.get(`/api/measurements?variantId=${variant.id}&pageSize=1`).expect(200)).body;
    const one = (await viewer.agent.get(`/api/measurements/${items[0].id}`).expect(200)).body.measurement;
    expect(one).toMatchObject({ id: items[0].id, variant: { id: variant.id, label: 'G12A', campaignId: campaign.id } });
    await viewer.agent.get('/api/measurements/999999').expect(404);
  });
});

describe('variant summary follows the review state', () => {
  it('drops a flagged measurement from the counted ones', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const fresh = await createVariantRow(testApp.dataSource, { campaign, mutations: [{ position: 13, from: 'A', to: 'S' }] });
    const count = async () =>
      ((await testApp.dataSource.query(`SELECT summary_measurement_count AS n FROM variants WHERE id = ?`, [fresh.id])) as { n: number }[])[0].n;
    const created = await enter(kineticist, { variantId: fresh.id });
    expect(await count()).toBe(1);
    const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
    await review(lead, created.id, { version: submitted.version, action: 'flag', reason: 'outlier' }).expect(200);
    expect(await count()).toBe(0);
  });
});

describe('role × route matrix for /api/measurements', () => {
  it.each(['viewer', 'biologist'])('returns 403 for a %s on every write', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.post('/api/measurements').set('X-CSRF-Token', session.csrfToken).send(enteredBody()).expect(403);
    await review(session, 1, { version: 1, action: 'submit' }).expect(403);
    await session.agent.post('/api/measurements/review').set('X-CSRF-Token', session.csrfToken).send({ items: [{ id: 1, version: 1 }], action: 'submit' }).expect(403);
    await session.agent.get('/api/measurements').expect(200);
  });

  it('returns 403 for a kineticist who approves or flags, and changes nothing', async () => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const created = await enter(kineticist);
    const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
    await review(kineticist, created.id, { version: submitted.version, action: 'approve' }).expect(403);
    await review(kineticist, created.id, { version: submitted.version, action: 'flag', reason: 'x' }).expect(403);
    await kineticist.agent
      .post('/api/measurements/review')
      .set('X-CSRF-Token', kineticist.csrfToken)
      .send({ items: [{ id: created.id, version: submitted.version }], action: 'approve' })
      .expect(403);
    expect(await stateOf(created.id)).toEqual({ review_state: 'submitted', version: submitted.version });
  });

  it.each(['lead', 'admin'])('lets a %s approve', async (role) => {
    const kineticist = await signedIn(testApp.app, demoEmail('kineticist'));
    const reviewer = await signedIn(testApp.app, demoEmail(role));
    const created = await enter(kineticist);
    const submitted = (await review(kineticist, created.id, { version: created.version, action: 'submit' }).expect(200)).body.measurement;
    await review(reviewer, created.id, { version: submitted.version, action: 'approve' }).expect(200);
  });

  it('requires the CSRF token on writes', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    await session.agent.post('/api/measurements').send(enteredBody()).expect(403);
  });
});
