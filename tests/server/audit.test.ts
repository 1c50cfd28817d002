import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/permissions';
import { campaignBody, enzymeBody } from './registry-fixtures';
import { signInEveryRole } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as } = await signInEveryRole(testApp.app));
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

interface AuditRow {
  id: number;
  at: string;
  actor: { id: number; name: string } | null;
  entityType: string;
  entityId: number;
  campaignId: number | null;
  action: string;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

async function eventCount(): Promise<number> {
  const [{ n }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM audit_events`);
  return n;
}

async function newEvents(since: number): Promise<AuditRow[]> {
  const response = await as('viewer').get('/api/audit?pageSize=200').expect(200);
  return (response.body.rows as AuditRow[]).filter((row) => row.id > since).reverse();
}

async function lastEventId(): Promise<number> {
  const [{ id }] = await testApp.dataSource.query(`SELECT COALESCE(MAX(id), 0) AS id FROM audit_events`);
  return id;
}

describe('audit events for every registry write', () => {
  it('records each write once, with who, what and the row before and after', async () => {
    let mark = await lastEventId();
    const summary = (rows: AuditRow[]) => rows.map((row) => `${row.actor?.name}: ${row.action} ${row.entityType}`);

    const enzyme = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body;
    await as('biologist').patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, organism: 'renamed organism' }).expect(200);
    const site = (await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 150, residue: 'W', role: 'substrate binding' }).expect(201)).body;
    await as('biologist').delete(`/api/enzymes/${enzyme.id}/sites/${site.id}`).expect(204);
    let rows = await newEvents(mark);
    expect(summary(rows)).toEqual([
      'Daniel Achterberg: create enzyme',
      'Daniel Achterberg: update enzyme',
      'Daniel Achterberg: create catalytic-site',
      'Daniel Achterberg: delete catalytic-site',
    ]);
    expect(rows[1]).toMatchObject({ entityId: enzyme.id, campaignId: null, before: { organism: 'synthetic construct', version: 1 }, after: { organism: 'renamed organism', version: 2 } });
    expect(rows[2]).toMatchObject({ entityId: site.id, before: null, after: { position: 150, role: 'substrate binding' } });
    expect(rows[3]).toMatchObject({ entityId: site.id, before: { position: 150 }, after: null });

    mark = await lastEventId();
    const campaign = (await as('lead').post('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    await as('lead').patch(`/api/campaigns/${campaign.id}`, { version: campaign.version, objective: 'Sharper objective.' }).expect(200);
    const variant = (await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112A' }).expect(201)).body;
    const cloned = (await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(200)).body;
    await as('lead').patch(`/api/variants/${variant.id}`, { version: cloned.version, notes: 'checked' }).expect(200);
    rows = await newEvents(mark);
    expect(summary(rows)).toEqual([
      'Tomas Varga-Reyes: create campaign',
      'Tomas Varga-Reyes: create variant',
      'Tomas Varga-Reyes: update campaign',
      'Daniel Achterberg: create variant',
      'Daniel Achterberg: status variant',
      'Tomas Varga-Reyes: update variant',
    ]);
    expect(rows.every((row) => row.campaignId === campaign.id)).toBe(true);
    expect(rows[1]).toMatchObject({ entityId: campaign.parentVariantId, after: { label: 'parent', status: 'purified' } });
    expect(rows[2]).toMatchObject({ before: { objective: 'Raise activity at mildly acidic pH.' }, after: { objective: 'Sharper objective.' } });
    expect(rows[3]).toMatchObject({ entityId: variant.id, before: null, after: { label: 'S112A', hgvs: 'p.Ser112Ala', status: 'designed' } });
    expect(rows[4]).toMatchObject({ before: { status: 'designed' }, after: { status: 'cloned' } });
  });

  it('records nothing for a refused write', async () => {
    const enzyme = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body;
    const campaign = (await as('lead').post('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    const variant = (await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'H190N' }).expect(201)).body;
    const before = await eventCount();
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'C112A' }).expect(400);
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'His190Asn' }).expect(409);
    await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version + 1, status: 'cloned' }).expect(409);
    await as('viewer').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(403);
    await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 112, residue: 'C', role: 'nucleophile' }).expect(400);
    await as('lead').patch(`/api/campaigns/${campaign.id}`, { version: campaign.version + 5, status: 'paused' }).expect(409);
    expect(await eventCount()).toBe(before);
  });
});

describe('GET /api/audit', () => {
  let campaign: { id: number; version: number; parentVariantId: number };
  let variantId: number;

  beforeAll(async () => {
    const enzyme = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body;
    campaign = (await as('lead').post('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    const variant = (await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'W150F' }).expect(201)).body;
    variantId = variant.id;
    await as('admin').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(200);
  });

  it('lists a campaign’s events newest first, with actor names, in pages', async () => {
    const all = (await as('viewer').get(`/api/audit?campaignId=${campaign.id}`).expect(200)).body;
    expect(all.total).toBe(4);
    expect(all.rows.map((row: AuditRow) => `${row.actor?.name}: ${row.action} ${row.entityType}`)).toEqual([
      'Ines Okafor-Lind: status variant',
      'Daniel Achterberg: create variant',
      'Tomas Varga-Reyes: create variant',
      'Tomas Varga-Reyes: create campaign',
    ]);
    const times = all.rows.map((row: AuditRow) => Date.parse(row.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);

    const second = (await as('viewer').get(`/api/audit?campaignId=${campaign.id}&pageSize=3&page=2`).expect(200)).body;
    expect(second).toMatchObject({ total: 4, page: 2, pageSize: 3 });
    expect(second.rows.map((row: AuditRow) => row.id)).toEqual([all.rows[3].id]);
  });

  it('filters by entity type and id', async () => {
    const variantEvents = (await as('viewer').get(`/api/audit?entityType=variant&entityId=${variantId}`).expect(200)).body;
    expect(variantEvents.rows.map((row: AuditRow) => row.action)).toEqual(['status', 'create']);
    const campaignEvents = (await as('viewer').get(`/api/audit?entityType=campaign&campaignId=${campaign.id}`).expect(200)).body;
    expect(campaignEvents.rows).toHaveLength(1);
    expect(campaignEvents.rows[0]).toMatchObject({ entityType: 'campaign', entityId: campaign.id, action: 'create' });
  });

  it.each(['admin', 'lead', 'kineticist', 'biologist', 'viewer'] as Role[])('is readable by a %s', async (role) => {
    await as(role).get('/api/audit?pageSize=1').expect(200);
  });

  it('returns 401 when signed out and 400 for a bad query', async () => {
    await request(testApp.app).get('/api/audit').expect(401);
    const bad = await as('viewer').get('/api/audit?entityType=Variant!&entityId=0&pageSize=201&order=asc').expect(400);
    expect(bad.body.error.fields).toMatchObject({
      entityType: 'must be an entity type such as variant, enzyme or campaign',
      entityId: 'must be an id (a whole number from 1)',
      pageSize: 'must be a whole number from 1 to 200',
    });
    expect(bad.body.error.fields._).toContain("unknown parameter 'order'");
  });
});
