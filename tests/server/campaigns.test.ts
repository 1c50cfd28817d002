import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Role } from '@shared/auth/permissions';
import { campaignBody, enzymeBody, uniqueName } from './registry-fixtures';
import { signInEveryRole } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];
let enzymeId: number;

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as } = await signInEveryRole(testApp.app));
  enzymeId = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body.id;
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

async function createCampaign(overrides: Record<string, unknown> = {}) {
  return (await as('lead').post('/api/campaigns', campaignBody(enzymeId, overrides)).expect(201)).body;
}

async function userId(email: string): Promise<number> {
  const [row] = await testApp.dataSource.query(`SELECT id FROM users WHERE email = ?`, [email]);
  return row.id;
}

describe('role × route matrix for /api/campaigns', () => {
  it.each(['biologist', 'kineticist', 'viewer'] as Role[])('returns 403 for a %s on every campaign write', async (role) => {
    const campaign = await createCampaign();
    await as(role).post('/api/campaigns', campaignBody(enzymeId)).expect(403);
    await as(role).patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, status: 'paused' }).expect(403);
    const after = (await as(role).get(`/api/campaigns/${campaign.id}`).expect(200)).body;
    expect(after).toMatchObject({ status: 'active', version: campaign.version });
  });

  it.each(['lead', 'admin'] as Role[])('lets a %s create and change campaigns', async (role) => {
    const campaign = (await as(role).post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
    await as(role).patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, status: 'paused' }).expect(200);
  });

  it.each(['admin', 'lead', 'kineticist', 'biologist', 'viewer'] as Role[])('lets a %s read campaigns', async (role) => {
    const campaign = await createCampaign();
    const list = (await as(role).get('/api/campaigns').expect(200)).body;
    expect(list.rows.some((row: { id: number }) => row.id === campaign.id)).toBe(true);
    await as(role).get(`/api/campaigns/${campaign.id}`).expect(200);
  });

  it('returns 401 when signed out', async () => {
    await request(testApp.app).get('/api/campaigns').expect(401);
  });
});

describe('POST /api/campaigns', () => {
  it('creates the campaign with its parent variant, led by its creator, and records both', async () => {
    const campaign = await createCampaign({ targetTemperatureC: 37, targetPh: 5.5 });
    expect(campaign).toMatchObject({
      enzymeId,
      targetPh: 5.5,
      targetTemperatureC: 37,
      status: 'active',
      lead: { id: await userId('lead@kcatalog.example'), name: 'Tomas Varga-Reyes' },
      variantTotal: 1,
      version: 1,
    });
    expect(campaign.variantCounts).toEqual({
      designed: 0,
      cloned: 0,
      'sequence-verified': 0,
      expressed: 0,
      purified: 1,
      characterized: 0,
      failed: 0,
      archived: 0,
    });
    const parent = (await as('viewer').get(`/api/variants/${campaign.parentVariantId}`).expect(200)).body;
    expect(parent).toMatchObject({ label: 'parent', hgvs: 'p.=', isParent: true, mutations: [], status: 'purified', campaignId: campaign.id });

    const [stored] = await testApp.dataSource.query(`SELECT target_temperature_k FROM campaigns WHERE id = ?`, [campaign.id]);
    // 37 °C is 310.15 K (t/°C = T/K − 273.15, SI Brochure section 2.3.1).
    expect(stored.target_temperature_k).toBeCloseTo(310.15, 10);

    const events = (await as('viewer').get(`/api/audit?campaignId=${campaign.id}`).expect(200)).body.rows;
    expect(events.map((event: { entityType: string; action: string }) => `${event.entityType} ${event.action}`).sort()).toEqual([
      'campaign create',
      'variant create',
    ]);
  });

  it('takes another lead, or none', async () => {
    const adminId = await userId('admin@kcatalog.example');
    expect((await createCampaign({ leadId: adminId })).lead).toEqual({ id: adminId, name: 'Ines Okafor-Lind' });
    expect(await createCampaign({ leadId: null })).toMatchObject({ leadId: null, lead: null });
  });

  it('refuses a lead who is not an active lead or admin', async () => {
    const biologistId = await userId('biologist@kcatalog.example');
    const notLead = await as('lead').post('/api/campaigns', campaignBody(enzymeId, { leadId: biologistId })).expect(400);
    expect(notLead.body.error.fields).toEqual({ leadId: 'Daniel Achterberg is a biologist; a campaign lead must have the lead or admin role' });

    await as('lead').post('/api/campaigns', campaignBody(enzymeId, { leadId: 999999 })).expect(400);

    const formerLead = (
      await as('admin').post('/api/users', { email: `former-${Date.now()}@kcatalog.example`, name: 'Former Lead', role: 'lead', password: 'long-enough-password' }).expect(201)
    ).body.user;
    await as('admin').patch(`/api/users/${formerLead.id}`, { version: formerLead.version, active: false }).expect(200);
    const inactive = await as('lead').post('/api/campaigns', campaignBody(enzymeId, { leadId: formerLead.id })).expect(400);
    expect(inactive.body.error.fields).toEqual({ leadId: 'Former Lead is deactivated' });
  });

  it('returns 400 with field messages for bad input and writes nothing', async () => {
    const name = uniqueName('Bad campaign');
    const response = await as('lead')
      .post('/api/campaigns', { name, objective: '', enzymeId: 'one', targetSubstrate: 'x', targetPh: 15, targetTemperatureC: 130, status: 'running' })
      .expect(400);
    expect(response.body.error.fields).toEqual({
      objective: 'is required (one sentence on what the campaign is to achieve)',
      enzymeId: 'must be the id of an enzyme',
      targetPh: 'must be between 0 and 14',
      targetTemperatureC: 'must be between -10 and 120 °C',
      status: 'must be one of active, paused, closed',
    });
    const missingEnzyme = await as('lead').post('/api/campaigns', campaignBody(999999, { name })).expect(400);
    expect(missingEnzyme.body.error.fields).toEqual({ enzymeId: 'no enzyme has id 999999' });
    const [{ n }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM campaigns WHERE name = ?`, [name]);
    expect(n).toBe(0);
  });

  it('returns 409 for a taken name', async () => {
    const campaign = await createCampaign();
    const response = await as('lead').post('/api/campaigns', campaignBody(enzymeId, { name: campaign.name.toLowerCase() })).expect(409);
    expect(response.body.error.existingCampaignId).toBe(campaign.id);
  });

  it('rolls the campaign back when its parent variant cannot be written', async () => {
    // Force the second insert of the transaction to fail: an orphan parent row already holds the
    // (campaign_id, mutation_key) pair the next campaign's parent will need.
    const [{ seq }] = await testApp.dataSource.query(`SELECT seq FROM sqlite_sequence WHERE name = 'campaigns'`);
    const nextCampaignId = Number(seq) + 1;
    await testApp.dataSource.query('PRAGMA foreign_keys = OFF');
    await testApp.dataSource.query(
      `INSERT INTO variants (campaign_id, enzyme_id, label, hgvs, mutation_key, mutation_count, status, version) VALUES (?, ?, 'parent', 'p.=', 'parent', 0, 'purified', 1)`,
      [nextCampaignId, enzymeId],
    );
    await testApp.dataSource.query('PRAGMA foreign_keys = ON');
    const name = uniqueName('Doomed campaign');
    const [{ n: eventsBefore }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM audit_events`);
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      await as('lead').post('/api/campaigns', campaignBody(enzymeId, { name })).expect(500);
      expect(logged).toHaveBeenCalledOnce();
    } finally {
      logged.mockRestore();
      await testApp.dataSource.query(`DELETE FROM variants WHERE campaign_id = ? AND mutation_key = 'parent'`, [nextCampaignId]);
    }
    const [{ n: campaigns }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM campaigns WHERE name = ? OR id = ?`, [name, nextCampaignId]);
    expect(campaigns).toBe(0);
    const [{ n: eventsAfter }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM audit_events`);
    expect(eventsAfter).toBe(eventsBefore);
    // Nothing is left over: the same campaign can be created afterwards.
    await as('lead').post('/api/campaigns', campaignBody(enzymeId, { name })).expect(201);
  });
});

describe('PATCH /api/campaigns/:id', () => {
  it('changes settings, records before and after, and refuses a stale version without overwriting', async () => {
    const campaign = await createCampaign();
    const changed = (
      await as('lead').patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, targetPh: 6.2, targetTemperatureC: 30, status: 'paused' }).expect(200)
    ).body;
    expect(changed).toMatchObject({ targetPh: 6.2, targetTemperatureC: 30, status: 'paused', version: 2, lead: campaign.lead });
    const stale = await as('admin').patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, status: 'closed' }).expect(409);
    expect(stale.body.error).toMatchObject({ code: 'stale_version', currentVersion: 2 });
    expect((await as('viewer').get(`/api/campaigns/${campaign.id}`).expect(200)).body).toMatchObject({ status: 'paused', version: 2 });

    const [update] = (await as('viewer').get(`/api/audit?entityType=campaign&entityId=${campaign.id}`).expect(200)).body.rows;
    expect(update).toMatchObject({ action: 'update', before: { targetPh: 5.5, status: 'active' }, after: { targetPh: 6.2, status: 'paused' } });
  });

  it('removes the lead with null and refuses an unknown field value', async () => {
    const campaign = await createCampaign();
    const changed = (await as('lead').patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, leadId: null }).expect(200)).body;
    expect(changed.lead).toBeNull();
    const empty = await as('lead').patch(`/api/campaigns/${campaign.id}`, { version: changed.version }).expect(400);
    expect(empty.body.error.fields).toEqual({ name: 'give at least one field to change' });
  });

  it('answers 404 for a missing campaign', async () => {
    await as('lead').patch('/api/campaigns/999999', { version: 1, status: 'paused' }).expect(404);
    await as('viewer').get('/api/campaigns/999999').expect(404);
  });
});

describe('GET /api/campaigns', () => {
  it('counts the variants of each campaign by status', async () => {
    const campaign = await createCampaign();
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112A', status: 'cloned' }).expect(201);
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'H190N', status: 'cloned' }).expect(201);
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112A/H190N' }).expect(201);
    const list = (await as('viewer').get('/api/campaigns').expect(200)).body;
    const row = list.rows.find((candidate: { id: number }) => candidate.id === campaign.id);
    expect(row).toMatchObject({ variantTotal: 4, variantCounts: { designed: 1, cloned: 2, purified: 1, characterized: 0 } });
    expect(list.total).toBe(list.rows.length);
  });
});

describe('GET /api/campaigns/lead-candidates', () => {
  it('lists the active leads and admins by name, for those who set a campaign lead', async () => {
    const formerAdmin = (
      await as('admin').post('/api/users', { email: `former-admin-${Date.now()}@kcatalog.example`, name: 'Aaron Former', role: 'admin', password: 'long-enough-password' }).expect(201)
    ).body.user;
    await as('admin').patch(`/api/users/${formerAdmin.id}`, { version: formerAdmin.version, active: false }).expect(200);

    const { rows } = (await as('lead').get('/api/campaigns/lead-candidates').expect(200)).body;
    expect(rows).toEqual([
      { id: await userId('admin@kcatalog.example'), name: 'Ines Okafor-Lind' },
      { id: await userId('lead@kcatalog.example'), name: 'Tomas Varga-Reyes' },
    ]);
    await as('admin').get('/api/campaigns/lead-candidates').expect(200);
  });

  it.each(['biologist', 'kineticist', 'viewer'] as Role[])('returns 403 for a %s', async (role) => {
    await as(role).get('/api/campaigns/lead-candidates').expect(403);
  });
});
