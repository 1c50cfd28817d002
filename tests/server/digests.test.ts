import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DigestContentDto, DigestRankedVariantDto } from '@shared/schemas/digest';
import { Campaign } from '@server/modules/campaigns/campaign.entity';
import { DigestRun } from '@server/modules/digests/digest-run.entity';
import { claimScheduledRun, runScheduledDigests } from '@server/modules/digests/digest-runs';
import { DigestScheduler } from '@server/modules/digests/digest-scheduler';
import { weekKeyOf } from '@server/modules/digests/digest-schedule';
import type { ReceivedMessage } from '@server/modules/mail/received-message.entity';
import { User } from '@server/modules/users/user.entity';
import { Variant } from '@server/modules/variants/variant.entity';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, inventedSequence } from '../factories';
import { createMailTestApp, linkPath, receivedFor, testPublicUrl, tokenOf, waitForMessages, type MailTestApp } from './mail-test-app';
import { signInEveryRole } from './role-sessions';
import { demoEmail, removeDataDir, signedIn } from './test-app';

// Expected ΔΔG‡ values are worked by hand from ΔΔG‡ = −RT ln(k_variant/k_parent) (Fersht, Structure and
// Mechanism in Protein Science, 1999, ch. 15) at the assay temperature 37 °C = 310.15 K, with
// R = 8.31446261815324 J mol⁻¹ K⁻¹ (CODATA 2018, exact), so RT = 2.578730581 kJ/mol; the standard error is
// RT·√((se_v/k_v)² + (se_p/k_p)²) (relative errors of independent measurements, Taylor, An Introduction to
// Error Analysis, 2nd ed., §3.8). All measurements are invented.
const RT_37 = 2.578730581020227;
const expected = {
  ratio3: -RT_37 * Math.log(3), // −2.833025 kJ/mol
  ratio2: -RT_37 * Math.log(2), // −1.787440
  ratio0_5: RT_37 * Math.log(2), // +1.787440
  ratio2_5: -RT_37 * Math.log(2.5), // −2.362867
  ratio2_2: -RT_37 * Math.log(2.2), // −2.033219
  se5and5: RT_37 * Math.hypot(0.05, 0.05), // 0.182344
  se10and5: RT_37 * Math.hypot(0.1, 0.05), // 0.288311
};
// Hand-computed figures written out, so the formula above is itself checked.
const handValues = { ratio3: -2.833025, ratio2: -1.78744, ratio2_5: -2.362867, ratio2_2: -2.033219, se5and5: 0.182344, se10and5: 0.288311 };

const parentKcatOverKm = 1e4;
const at37 = { temperatureC: 37, ph: 6 };
const scriptNote = '<script>alert("digest")</script> best so far';

let testApp: MailTestApp;
let roles: Awaited<ReturnType<typeof signInEveryRole>>;
let campaign: Campaign;
let parent: Variant;
let variants: Record<'A' | 'B' | 'C' | 'D' | 'E' | 'F', Variant>;
let leadId: number;

/** Enters a measurement as the kineticist (kcat/Km with a relative SE) and takes it to the review state. */
async function measure(variantId: number, kcatOverKm: number, relativeSe: number, state: 'draft' | 'submitted' | 'approved', conditions = at37): Promise<number> {
  const kcat = 10;
  const { body } = await roles
    .as('kineticist')
    .post('/api/measurements', {
      variantId,
      substrate: 'pNP-acetate',
      ...conditions,
      assayDate: '2026-03-05',
      kcat: { value: kcat, se: 0.5, unit: '1/s' },
      km: { value: kcat / kcatOverKm, se: (0.1 * kcat) / kcatOverKm, unit: 'M' },
      kcatOverKm: { value: kcatOverKm, se: relativeSe * kcatOverKm, unit: 'M⁻¹ s⁻¹' },
    })
    .expect(201);
  const id = (body.measurement as { id: number }).id;
  let version = (body.measurement as { version: number }).version;
  if (state !== 'draft') version = (await roles.as('kineticist').post(`/api/measurements/${id}/review`, { version, action: 'submit' }).expect(200)).body.measurement.version;
  if (state === 'approved') await roles.as('lead').post(`/api/measurements/${id}/review`, { version, action: 'approve' }).expect(200);
  return id;
}

async function retract(id: number): Promise<void> {
  const { body } = await roles.as('lead').get(`/api/measurements/${id}`).expect(200);
  await roles.as('lead').post(`/api/measurements/${id}/review`, { version: body.measurement.version, action: 'retract', reason: 'Wrong enzyme stock (test fixture)' }).expect(200);
}

function byLabel(ranking: readonly DigestRankedVariantDto[]): Record<string, DigestRankedVariantDto> {
  return Object.fromEntries(ranking.map((entry) => [entry.label, entry]));
}

function header(message: ReceivedMessage, name: string): string | undefined {
  return message.headers.find((line) => line.name.toLowerCase() === name.toLowerCase())?.value;
}

let cMeasurementId: number;

beforeAll(async () => {
  testApp = await createMailTestApp();
  roles = await signInEveryRole(testApp.app);
  const sequence = inventedSequence(300, { 45: 'D', 112: 'S', 150: 'W', 190: 'H', 230: 'D' });
  const enzyme = await createEnzymeRow(testApp.dataSource, { sequence });
  ({ campaign, parent } = await createCampaignWithParent(testApp.dataSource, { enzyme, targetSubstrate: 'pNP-acetate', targetPh: 6, targetTemperatureC: 37 }));
  leadId = (await testApp.dataSource.getRepository(User).findOneByOrFail({ email: demoEmail('lead') })).id;
  await testApp.dataSource.getRepository(Campaign).update({ id: campaign.id }, { leadId });
  const variant = (position: number, from: string, to: string) => createVariantRow(testApp.dataSource, { campaign, mutations: [{ position, from, to }] });
  variants = {
    A: await variant(112, 'S', 'A'),
    B: await variant(190, 'H', 'N'),
    C: await variant(45, 'D', 'E'),
    D: await variant(45, 'D', 'N'),
    E: await variant(150, 'W', 'F'),
    F: await variant(230, 'D', 'N'),
  };
  await testApp.dataSource.getRepository(Variant).update({ id: variants.A.id }, { notes: scriptNote });

  await measure(parent.id, parentKcatOverKm, 0.05, 'approved');
  await measure(variants.A.id, 3 * parentKcatOverKm, 0.05, 'approved');
  await measure(variants.B.id, 2 * parentKcatOverKm, 0.1, 'submitted');
  cMeasurementId = await measure(variants.C.id, 0.5 * parentKcatOverKm, 0.1, 'approved');
  // A draft never counts in a digest, however fast.
  await measure(variants.D.id, 10 * parentKcatOverKm, 0.05, 'draft');
  // Measured only at 25 °C, where the parent was not: no comparison; kcat/Km 2 × 10⁸ M⁻¹ s⁻¹ is near the diffusion limit.
  await measure(variants.E.id, 2e8, 0.05, 'approved', { temperatureC: 25, ph: 6 });
  await put('kineticist', `/api/digests/campaigns/${campaign.id}/subscription`, { subscribed: true, version: null }).expect(200);
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

function put(role: Parameters<typeof roles.as>[0], url: string, body: object) {
  const session = roles.sessions[role];
  return session.agent.put(url).set('X-CSRF-Token', session.csrfToken).send(body);
}

describe('the hand-computed figures', () => {
  it('agree with the formula', () => {
    for (const [name, value] of Object.entries(handValues)) expect(expected[name as keyof typeof handValues]).toBeCloseTo(value, 5);
  });
});

describe('GET /api/digests/campaigns/:id/preview', () => {
  it('ranks submitted and approved measurements by ΔΔG‡ for kcat/Km against the matched parent', async () => {
    const { body } = await roles.as('lead').get(`/api/digests/campaigns/${campaign.id}/preview`).expect(200);
    const content = body.content as DigestContentDto;
    expect(content.reviewStates).toEqual(['submitted', 'approved']);
    expect(content.ranking.map((entry) => entry.label)).toEqual(['S112A', 'H190N', 'D45E']);
    const ranked = byLabel(content.ranking);
    expect(ranked.S112A.ddgKjPerMol.value).toBeCloseTo(expected.ratio3, 6);
    expect(ranked.S112A.ddgKjPerMol.se).toBeCloseTo(expected.se5and5, 6);
    expect(ranked.S112A.foldChange?.value).toBeCloseTo(3, 10);
    expect(ranked.S112A).toMatchObject({ rank: 1, n: 1, reviewStates: { approved: 1 }, clearOfParent: true, substrate: 'pNP-acetate', temperatureC: 37, ph: 6 });
    expect(ranked.H190N.ddgKjPerMol.value).toBeCloseTo(expected.ratio2, 6);
    expect(ranked.H190N.ddgKjPerMol.se).toBeCloseTo(expected.se10and5, 6);
    expect(ranked.H190N.reviewStates).toEqual({ submitted: 1 });
    expect(ranked.D45E.ddgKjPerMol.value).toBeCloseTo(expected.ratio0_5, 6);
    expect(ranked.D45E.foldChange?.value).toBeCloseTo(0.5, 10);
    expect(content.rankedCount).toBe(3);
    expect(content.unmatchedCount).toBe(1);
    expect(content.flags.items.find((item) => item.label === 'W150F')?.codes).toContain('near-diffusion-limit');
    expect(content.movers.since).toBeNull();
    expect(content.awaitingReview.total).toBe(1);
    expect(content.awaitingReview.items[0].label).toBe('H190N');
    expect(content.addedMeasurements.total).toBe(6);
    expect(content.addedMeasurements.byState).toEqual({ approved: 4, submitted: 1, draft: 1 });
    expect(content.addedVariants.total).toBe(6);
    expect(content.registryPath).toBe(`/registry?campaignId=${campaign.id}&sort=ddg&order=asc`);
    expect(body.recipientCount).toBe(2);
    expect(body.subject).toContain(campaign.name);
  });

  it('escapes the variant note in the HTML part and keeps it as text in the plain part', async () => {
    const { body } = await roles.as('viewer').get(`/api/digests/campaigns/${campaign.id}/preview`).expect(200);
    expect(body.html).not.toContain('<script');
    expect(body.html).toContain('&lt;script&gt;alert(&quot;digest&quot;)&lt;/script&gt; best so far');
    expect(body.text).toContain(scriptNote);
  });

  it('answers 404 for an unknown campaign and 400 for a bad id', async () => {
    await roles.as('lead').get('/api/digests/campaigns/999999/preview').expect(404);
    await roles.as('lead').get('/api/digests/campaigns/first/preview').expect(400);
  });
});

describe('POST /api/digests/campaigns/:id/send', () => {
  let firstRunId: number;

  it('returns 403 for roles without digests:manage', async () => {
    for (const role of ['kineticist', 'biologist', 'viewer'] as const) await roles.as(role).post(`/api/digests/campaigns/${campaign.id}/send`).expect(403);
  });

  it('sends the digest over SMTP to the lead (subscribed by default) and to subscribers, escaped, with List-Unsubscribe', async () => {
    const { body } = await roles.as('lead').post(`/api/digests/campaigns/${campaign.id}/send`).expect(201);
    firstRunId = body.run.id;
    expect(body.run).toMatchObject({ kind: 'manual', status: 'queued', recipientCount: 2, weekKey: null });
    const [toLead] = await waitForMessages(testApp.dataSource, demoEmail('lead'));
    const [toKineticist] = await waitForMessages(testApp.dataSource, demoEmail('kineticist'));
    expect(toLead.html).not.toContain('<script');
    expect(toLead.html).toContain('&lt;script&gt;');
    expect(toLead.text).toContain('−2.83 ± 0.18');
    expect(toLead.text).toContain('as the lead of');
    expect(toKineticist.text).toContain('because you subscribed');
    const unsubscribeHeader = header(toKineticist, 'List-Unsubscribe');
    expect(unsubscribeHeader).toMatch(new RegExp(`^<${testPublicUrl}/api/digests/unsubscribe\\?token=[A-Za-z0-9_-]{43}>$`));
    expect(header(toKineticist, 'List-Unsubscribe-Post')).toBe('List-Unsubscribe=One-Click');
    expect(await receivedFor(testApp.dataSource, demoEmail('viewer'))).toHaveLength(0);
  });

  it('shows the run with its recipients to a lead and without their addresses to a viewer', async () => {
    const lead = await roles.as('lead').get(`/api/digests/runs/${firstRunId}`).expect(200);
    expect(lead.body.run.recipients.map((recipient: { email: string }) => recipient.email).sort()).toEqual([demoEmail('kineticist'), demoEmail('lead')]);
    expect(lead.body.run.content.ranking[0].label).toBe('S112A');
    expect(lead.body.run.html).toContain('S112A');
    expect(lead.body.run.html).not.toContain('token=');
    const viewer = await roles.as('viewer').get(`/api/digests/runs/${firstRunId}`).expect(200);
    expect(viewer.body.run.recipients).toEqual([]);
    await roles.as('viewer').get('/api/digests/runs/999999').expect(404);
  });

  it('lists the rank movers since the previous digest', async () => {
    // Lead's choice for this test: the top three.
    await put('lead', `/api/digests/campaigns/${campaign.id}/settings`, { version: null, reviewStates: ['submitted', 'approved'], topCount: 3 }).expect(200);
    const before = await roles.as('lead').get(`/api/digests/runs/${firstRunId}`).expect(200);
    expect(before.body.run.content.ranking.map((entry: { label: string }) => entry.label)).toEqual(['S112A', 'H190N', 'D45E']);

    // D45E is re-measured 2.5-fold faster than the parent; D230N arrives 2.2-fold faster (submitted).
    await retract(cMeasurementId);
    await measure(variants.C.id, 2.5 * parentKcatOverKm, 0.05, 'approved');
    await measure(variants.F.id, 2.2 * parentKcatOverKm, 0.05, 'submitted');

    const { body } = await roles.as('lead').post(`/api/digests/campaigns/${campaign.id}/send`).expect(201);
    const run = await roles.as('lead').get(`/api/digests/runs/${body.run.id}`).expect(200);
    const content = run.body.run.content as DigestContentDto;
    expect(content.ranking.map((entry) => [entry.rank, entry.label])).toEqual([
      [1, 'S112A'],
      [2, 'D45E'],
      [3, 'D230N'],
    ]);
    expect(byLabel(content.ranking).D45E.ddgKjPerMol.value).toBeCloseTo(expected.ratio2_5, 6);
    expect(byLabel(content.ranking).D230N.ddgKjPerMol.value).toBeCloseTo(expected.ratio2_2, 6);
    expect(content.rankedCount).toBe(4);
    expect(content.movers.since?.runId).toBe(firstRunId);
    expect(content.movers.up).toEqual([{ variantId: variants.C.id, label: 'D45E', previousRank: 3, rank: 2 }]);
    expect(content.movers.down).toEqual([{ variantId: variants.B.id, label: 'H190N', previousRank: 2, rank: 4 }]);
    expect(content.movers.new).toEqual([{ variantId: variants.F.id, label: 'D230N', previousRank: null, rank: 3 }]);
    const messages = await waitForMessages(testApp.dataSource, demoEmail('lead'), 2);
    expect(messages[1].text).toContain('D45E (#3 → #2)');
    expect(messages[1].text).toContain('H190N (#2 → #4)');
  });
});

describe('PUT /api/digests/campaigns/:id/settings', () => {
  it('lets the lead rank on approved measurements only', async () => {
    const current = await roles.as('lead').get('/api/digests/campaigns').expect(200);
    const settings = current.body.campaigns.find((item: { campaign: { id: number } }) => item.campaign.id === campaign.id).settings;
    const saved = await put('lead', `/api/digests/campaigns/${campaign.id}/settings`, { version: settings.version, reviewStates: ['approved'], topCount: 10 }).expect(200);
    expect(saved.body.settings).toMatchObject({ reviewStates: ['approved'], topCount: 10, version: settings.version + 1 });
    const { body } = await roles.as('lead').get(`/api/digests/campaigns/${campaign.id}/preview`).expect(200);
    expect(body.content.ranking.map((entry: { label: string }) => entry.label)).toEqual(['S112A', 'D45E']);
    expect(body.content.reviewStates).toEqual(['approved']);
  });

  it('refuses a stale version with 409 and bad input with field messages, changing nothing', async () => {
    const stale = await put('lead', `/api/digests/campaigns/${campaign.id}/settings`, { version: 1, reviewStates: ['submitted'], topCount: 5 }).expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    const bad = await put('lead', `/api/digests/campaigns/${campaign.id}/settings`, { version: 2, reviewStates: ['draft'], topCount: 0 }).expect(400);
    expect(bad.body.error.fields).toEqual({ 'reviewStates.0': 'must be one of submitted, approved', topCount: 'must be from 1 to 50' });
    const empty = await put('lead', `/api/digests/campaigns/${campaign.id}/settings`, { version: 2, reviewStates: [], topCount: 5 }).expect(400);
    expect(empty.body.error.fields).toEqual({ reviewStates: 'choose at least one review state' });
    const { body } = await roles.as('lead').get('/api/digests/campaigns').expect(200);
    expect(body.campaigns.find((item: { campaign: { id: number } }) => item.campaign.id === campaign.id).settings).toMatchObject({ reviewStates: ['approved'], topCount: 10 });
    await put('kineticist', `/api/digests/campaigns/${campaign.id}/settings`, { version: 2, reviewStates: ['approved'], topCount: 5 }).expect(403);
  });
});

describe('unsubscribing', () => {
  it('works with one click from the List-Unsubscribe header (no session, no CSRF token) and is honoured', async () => {
    const [first] = await receivedFor(testApp.dataSource, demoEmail('kineticist'));
    const url = new URL(header(first, 'List-Unsubscribe')!.slice(1, -1));
    const response = await request(testApp.app).post(`${url.pathname}${url.search}`).type('form').send('List-Unsubscribe=One-Click').expect(200);
    expect(response.body.unsubscribe).toMatchObject({ subscribed: false, email: demoEmail('kineticist'), campaign: { id: campaign.id } });
    const { body } = await roles.as('kineticist').get('/api/digests/campaigns').expect(200);
    expect(body.campaigns.find((item: { campaign: { id: number } }) => item.campaign.id === campaign.id).subscription.subscribed).toBe(false);

    const before = (await receivedFor(testApp.dataSource, demoEmail('kineticist'))).length;
    const run = await roles.as('lead').post(`/api/digests/campaigns/${campaign.id}/send`).expect(201);
    expect(run.body.run.recipientCount).toBe(1);
    await waitForMessages(testApp.dataSource, demoEmail('lead'), 3);
    await testApp.delivery.idle();
    expect(await receivedFor(testApp.dataSource, demoEmail('kineticist'))).toHaveLength(before);
  });

  it('works from the link in the message, and the lead’s choice sticks', async () => {
    const messages = await receivedFor(testApp.dataSource, demoEmail('lead'));
    const token = tokenOf(linkPath(messages[messages.length - 1].text, '/unsubscribe'));
    const lookup = await request(testApp.app).get(`/api/digests/unsubscribe?token=${token}`).expect(200);
    expect(lookup.body.unsubscribe).toMatchObject({ subscribed: true, email: demoEmail('lead') });
    await request(testApp.app).post('/api/digests/unsubscribe').send({ token }).expect(200);
    // Twice is fine.
    const again = await request(testApp.app).post('/api/digests/unsubscribe').send({ token }).expect(200);
    expect(again.body.unsubscribe.subscribed).toBe(false);
    const refused = await roles.as('lead').post(`/api/digests/campaigns/${campaign.id}/send`).expect(409);
    expect(refused.body.error.code).toBe('no_recipients');
    const { body } = await roles.as('lead').get('/api/digests/campaigns').expect(200);
    expect(body.campaigns.find((item: { campaign: { id: number } }) => item.campaign.id === campaign.id)).toMatchObject({
      subscriberCount: 0,
      subscription: { subscribed: false, byDefault: false },
    });
  });

  it('answers 400 with a field message for a bad or unknown token', async () => {
    const bad = await request(testApp.app).post('/api/digests/unsubscribe').send({ token: 'nope' }).expect(400);
    expect(bad.body.error.fields.token).toMatch(/not a valid link/);
    const unknown = await request(testApp.app).get(`/api/digests/unsubscribe?token=${'C'.repeat(43)}`).expect(400);
    expect(unknown.body.error.fields).toEqual({ token: 'is not a valid unsubscribe link' });
  });
});

describe('PUT /api/digests/campaigns/:id/subscription', () => {
  it('lets anyone subscribe themselves, refusing a stale version', async () => {
    const { body } = await roles.as('viewer').get('/api/digests/campaigns').expect(200);
    const state = body.campaigns.find((item: { campaign: { id: number } }) => item.campaign.id === campaign.id).subscription;
    expect(state).toEqual({ subscribed: false, byDefault: false, version: null });
    const subscribed = await put('viewer', `/api/digests/campaigns/${campaign.id}/subscription`, { subscribed: true, version: null }).expect(200);
    expect(subscribed.body.subscription).toEqual({ subscribed: true, byDefault: false, version: 1 });
    const stale = await put('viewer', `/api/digests/campaigns/${campaign.id}/subscription`, { subscribed: false, version: null }).expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    const bad = await put('viewer', `/api/digests/campaigns/${campaign.id}/subscription`, { subscribed: 'yes' }).expect(400);
    expect(bad.body.error.fields).toMatchObject({ subscribed: 'must be true or false' });
    const subscribers = await roles.as('lead').get(`/api/digests/campaigns/${campaign.id}/subscribers`).expect(200);
    expect(subscribers.body.subscribers.map((item: { email: string }) => item.email)).toEqual([demoEmail('viewer')]);
    await roles.as('viewer').get(`/api/digests/campaigns/${campaign.id}/subscribers`).expect(403);
    await put('viewer', '/api/digests/campaigns/999999/subscription', { subscribed: true, version: null }).expect(404);
  });
});

describe('the weekly schedule', () => {
  // A Monday 07:00 UTC slot (the default schedule).
  const slot = new Date('2026-06-01T07:00:00.000Z');

  it('sends each campaign’s digest once per week, even when the slot is run again or the server restarts', async () => {
    const dataDir = testApp.dataDir;
    const weekKey = weekKeyOf(slot, 'UTC');
    const scheduled = (await testApp.dataSource.getRepository(DigestRun).findBy({ kind: 'scheduled' })).length;
    expect(scheduled).toBe(0);
    // The viewer is the one recipient left (subscribed above).
    expect(await runScheduledDigests(testApp.dataSource, testApp.mail, slot)).toHaveLength(1);
    expect(await runScheduledDigests(testApp.dataSource, testApp.mail, slot)).toHaveLength(0);
    await waitForMessages(testApp.dataSource, demoEmail('viewer'), 1);

    // A restart: a new app on the same data folder whose scheduler catches up the slot 10 minutes later.
    await testApp.close();
    testApp = await createMailTestApp({ dataDir });
    const scheduler = new DigestScheduler(testApp.dataSource, testApp.mail);
    await scheduler.start(new Date(slot.getTime() + 10 * 60_000));
    await scheduler.stop();
    await testApp.delivery.idle();
    await new Promise((done) => setTimeout(done, 200));
    expect(await testApp.dataSource.getRepository(DigestRun).countBy({ campaignId: campaign.id, weekKey })).toBe(1);
    expect(await receivedFor(testApp.dataSource, demoEmail('viewer'))).toHaveLength(1);
  });

  it('resumes a run a restart interrupted, without repeating it', async () => {
    const nextSlot = new Date(slot.getTime() + 7 * 24 * 3600_000);
    const weekKey = weekKeyOf(nextSlot, 'UTC');
    const claimed = await claimScheduledRun(testApp.dataSource, campaign.id, weekKey, nextSlot);
    expect(claimed).not.toBeNull();
    // The process dies here, after the claim and before any message was queued.
    const dataDir = testApp.dataDir;
    await testApp.close();
    testApp = await createMailTestApp({ dataDir });
    expect((await testApp.dataSource.getRepository(DigestRun).findOneByOrFail({ id: claimed! })).status).toBe('preparing');

    const scheduler = new DigestScheduler(testApp.dataSource, testApp.mail);
    await scheduler.start(new Date(nextSlot.getTime() + 5 * 60_000));
    await scheduler.stop();
    await waitForMessages(testApp.dataSource, demoEmail('viewer'), 2);
    const run = await testApp.dataSource.getRepository(DigestRun).findOneByOrFail({ id: claimed! });
    expect(run).toMatchObject({ status: 'queued', recipientCount: 1, weekKey });
    expect(await runScheduledDigests(testApp.dataSource, testApp.mail, nextSlot)).toEqual([]);
    await testApp.delivery.idle();
    await new Promise((done) => setTimeout(done, 200));
    expect(await receivedFor(testApp.dataSource, demoEmail('viewer'))).toHaveLength(2);
    expect(await testApp.dataSource.getRepository(DigestRun).countBy({ campaignId: campaign.id, weekKey })).toBe(1);
  });

  it('does not send a slot that passed more than an hour before the server started', async () => {
    const laterSlot = new Date(slot.getTime() + 14 * 24 * 3600_000);
    const scheduler = new DigestScheduler(testApp.dataSource, testApp.mail);
    await scheduler.start(new Date(laterSlot.getTime() + 2 * 3600_000));
    await scheduler.stop();
    expect(await testApp.dataSource.getRepository(DigestRun).countBy({ weekKey: weekKeyOf(laterSlot, 'UTC') })).toBe(0);
  });

  it('lists past runs, newest first, with how their messages stand', async () => {
    // The sessions of the first app ended with it; sign in on the restarted one.
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const { body } = await viewer.agent.get(`/api/digests/runs?campaignId=${campaign.id}`).expect(200);
    expect(body.total).toBe(5);
    expect(body.rows.map((run: { kind: string; weekKey: string | null }) => [run.kind, run.weekKey])).toEqual([
      ['scheduled', '2026-06-08'],
      ['scheduled', '2026-06-01'],
      ['manual', null],
      ['manual', null],
      ['manual', null],
    ]);
    expect(body.rows[0].delivery).toEqual({ queued: 0, sending: 0, sent: 1, failed: 0 });
    const bad = await viewer.agent.get('/api/digests/runs?pageSize=1000&campaignId=x').expect(400);
    expect(bad.body.error.fields).toMatchObject({ pageSize: 'must be at most 100', campaignId: 'must be a number' });
  });
});
