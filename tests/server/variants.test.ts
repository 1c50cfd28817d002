import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/permissions';
import { setVariantSummary } from '../factories';
import { campaignBody, enzymeBody } from './registry-fixtures';
import { signInEveryRole } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];
let enzymeId: number;
let campaign: { id: number; parentVariantId: number; version: number };
let otherCampaign: { id: number; parentVariantId: number };

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as } = await signInEveryRole(testApp.app));
  enzymeId = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body.id;
  campaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
  otherCampaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

async function register(mutations: string, extra: Record<string, unknown> = {}, campaignId = campaign.id) {
  return (await as('biologist').post('/api/variants', { campaignId, mutations, ...extra }).expect(201)).body;
}

async function variantCount(campaignId: number): Promise<number> {
  const [{ n }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM variants WHERE campaign_id = ?`, [campaignId]);
  return n;
}

describe('role × route matrix for /api/variants', () => {
  it.each(['kineticist', 'viewer'] as Role[])('returns 403 for a %s on every variant write', async (role) => {
    const variant = await register(`S112${role === 'viewer' ? 'G' : 'V'}`);
    const before = await variantCount(campaign.id);
    await as(role).post('/api/variants', { campaignId: campaign.id, mutations: 'H190Q' }).expect(403);
    await as(role).patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(403);
    expect(await variantCount(campaign.id)).toBe(before);
    expect((await as(role).get(`/api/variants/${variant.id}`).expect(200)).body).toMatchObject({ status: 'designed', version: variant.version });
  });

  it.each([
    ['biologist', 'W150Y'],
    ['lead', 'W150H'],
    ['admin', 'W150L'],
  ] as [Role, string][])('lets a %s register and edit variants', async (role, mutations) => {
    const variant = (await as(role).post('/api/variants', { campaignId: campaign.id, mutations }).expect(201)).body;
    await as(role).patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(200);
  });

  it.each(['admin', 'lead', 'kineticist', 'biologist', 'viewer'] as Role[])('lets a %s read the registry', async (role) => {
    await as(role).get(`/api/variants?campaignId=${campaign.id}`).expect(200);
    await as(role).get(`/api/variants/${campaign.parentVariantId}`).expect(200);
  });

  it('returns 401 when signed out', async () => {
    await request(testApp.app).get('/api/variants').expect(401);
    await request(testApp.app).get(`/api/variants/${campaign.parentVariantId}`).expect(401);
  });
});

describe('POST /api/variants', () => {
  it('parses the mutations against the parent and returns the canonical label, HGVS and mutations', async () => {
    const variant = (
      await as('biologist')
        .post('/api/variants', { campaignId: campaign.id, mutations: 'H190N+ser112ala', constructId: ' pKC-112-190 ', notes: 'round 1' })
        .expect(201)
    ).body;
    expect(variant).toMatchObject({
      label: 'S112A/H190N',
      hgvs: 'p.[Ser112Ala;His190Asn]',
      mutations: [
        { position: 112, from: 'S', to: 'A', roles: ['nucleophile'] },
        { position: 190, from: 'H', to: 'N', roles: ['general base'] },
      ],
      positions: [112, 190],
      roles: ['nucleophile', 'general base'],
      campaignId: campaign.id,
      enzymeId,
      status: 'designed',
      constructId: 'pKC-112-190',
      notes: 'round 1',
      isParent: false,
      kcat: null,
      ddg: null,
      measurementCount: 0,
      version: 1,
      createdBy: { name: 'Daniel Achterberg' },
    });
    expect(variant.catalyticSites.map((site: { position: number; role: string; mutation: string }) => `${site.mutation} ${site.role}`)).toEqual([
      'S112A nucleophile',
      'H190N general base',
    ]);
    expect(variant.statusHistory).toEqual([{ status: 'designed', previousStatus: null, at: expect.any(String), actor: { id: expect.any(Number), name: 'Daniel Achterberg' } }]);
  });

  // Messages as the shared parser words them; its notation is checked against the HGVS substitution
  // examples in tests/shared/mutations/parse-mutations.test.ts.
  it.each([
    ['a wrong reference residue', 'C112A', 'C112A: position 112 of the parent is Ser, not Cys'],
    ['a position beyond the sequence', 'G301A', 'G301A: position 301 is beyond the parent sequence (300 residues)'],
    ['an unknown amino acid', 'S112B', "S112B: unknown amino acid 'B'"],
    ['an unknown three-letter amino acid', 'p.Ser112Xyz', "p.Ser112Xyz: unknown amino acid 'Xyz'"],
    ['two changes at one position', 'S112A/S112T', 'S112T: two changes at position 112 (S112A and S112T)'],
    ['a synonymous change', 'S112S', 'S112S: synonymous change, position 112 stays Ser; list only residues that change'],
  ])('refuses %s with the parser message on the mutations field and writes nothing', async (_case, mutations, message) => {
    const before = await variantCount(campaign.id);
    const response = await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations }).expect(400);
    expect(response.body.error).toMatchObject({ code: 'validation_error', fields: { mutations: message } });
    expect(response.body.error.problems).toHaveLength(1);
    expect(await variantCount(campaign.id)).toBe(before);
  });

  it('lists every problem of the text, joined, and as a list', async () => {
    const response = await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'C112A/H190N/G301A' }).expect(400);
    expect(response.body.error.fields.mutations).toBe(
      'C112A: position 112 of the parent is Ser, not Cys; G301A: position 301 is beyond the parent sequence (300 residues)',
    );
    expect(response.body.error.problems).toEqual([
      { token: 'C112A', message: 'position 112 of the parent is Ser, not Cys' },
      { token: 'G301A', message: 'position 301 is beyond the parent sequence (300 residues)' },
    ]);
  });

  it('refuses the empty set: the campaign has its parent already', async () => {
    for (const mutations of ['', 'wild type', 'p.=']) {
      const response = await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations }).expect(400);
      expect(response.body.error.fields.mutations).toBe(
        `names no substitution: that is the parent, which the campaign already has (variant ${campaign.parentVariantId})`,
      );
    }
  });

  it('returns 409 naming the existing variant for the same set in another notation', async () => {
    const existing = await register('C45A/H190N');
    const before = await variantCount(campaign.id);
    const response = await as('lead').post('/api/variants', { campaignId: campaign.id, mutations: 'p.[His190Asn;Cys45Ala]' }).expect(409);
    expect(response.body.error).toMatchObject({
      code: 'duplicate_variant',
      existingVariantId: existing.id,
      label: 'C45A/H190N',
      message: `C45A/H190N is already registered in this campaign as variant ${existing.id}.`,
    });
    expect(await variantCount(campaign.id)).toBe(before);
    // Another campaign on the same enzyme may hold the same set.
    await register('p.(Cys45Ala) His190Asn', {}, otherCampaign.id);
  });

  it('registers a set once when two people send it at the same moment', async () => {
    const [first, second] = await Promise.all([
      as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'W150F/H190N' }),
      as('lead').post('/api/variants', { campaignId: campaign.id, mutations: 'H190N/W150F' }),
    ]);
    expect([first.status, second.status].sort()).toEqual([201, 409]);
    const created = first.status === 201 ? first : second;
    const refused = first.status === 201 ? second : first;
    expect(refused.body.error.existingVariantId).toBe(created.body.id);
  });

  it('takes a lineage parent from the same campaign only', async () => {
    const first = await register('D230E');
    const second = await register('D230E/W150F', { parentVariantId: first.id });
    expect(second.lineage.parent).toEqual({ id: first.id, label: 'D230E', status: 'designed' });
    const elsewhere = await as('biologist')
      .post('/api/variants', { campaignId: otherCampaign.id, mutations: 'D230E', parentVariantId: first.id })
      .expect(400);
    expect(elsewhere.body.error.fields).toEqual({ parentVariantId: `variant ${first.id} belongs to another campaign; lineage stays within one campaign` });
    const missing = await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'D230Q', parentVariantId: 999999 }).expect(400);
    expect(missing.body.error.fields).toEqual({ parentVariantId: 'no variant has id 999999' });
  });

  it('returns 400 for an unknown or closed campaign and for a bad body', async () => {
    const unknown = await as('biologist').post('/api/variants', { campaignId: 999999, mutations: 'S112A' }).expect(400);
    expect(unknown.body.error.fields).toEqual({ campaignId: 'no campaign has id 999999' });

    const closing = (await as('lead').post('/api/campaigns', campaignBody(enzymeId, { status: 'closed' })).expect(201)).body;
    const closed = await as('biologist').post('/api/variants', { campaignId: closing.id, mutations: 'S112A' }).expect(400);
    expect(closed.body.error.fields.campaignId).toBe(`campaign ${closing.name} is closed; reopen it to register variants`);

    const bad = await as('biologist').post('/api/variants', { campaignId: 'x', status: 'shipped', notes: 5 }).expect(400);
    expect(bad.body.error.fields).toEqual({
      campaignId: 'must be the id of a campaign',
      mutations: 'is required (e.g. C112A/H190N)',
      status: 'must be one of designed, cloned, sequence-verified, expressed, purified, characterized, failed, archived',
      notes: 'must be text or null',
    });
  });
});

describe('GET and PATCH /api/variants/:id', () => {
  it('records status changes as history and in the audit trail', async () => {
    const variant = await register('W150F/H190A');
    const cloned = (await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(200)).body;
    const verified = (
      await as('lead').patch(`/api/variants/${variant.id}`, { version: cloned.version, status: 'sequence-verified', constructId: 'pKC-77' }).expect(200)
    ).body;
    const noted = (await as('biologist').patch(`/api/variants/${variant.id}`, { version: verified.version, notes: 'sequenced twice' }).expect(200)).body;
    expect(noted).toMatchObject({ status: 'sequence-verified', constructId: 'pKC-77', notes: 'sequenced twice', version: 4 });
    expect(noted.statusHistory.map((change: { previousStatus: string | null; status: string; actor: { name: string } }) => [change.previousStatus, change.status, change.actor.name])).toEqual([
      [null, 'designed', 'Daniel Achterberg'],
      ['designed', 'cloned', 'Daniel Achterberg'],
      ['cloned', 'sequence-verified', 'Tomas Varga-Reyes'],
    ]);
    const events = (await as('viewer').get(`/api/audit?entityType=variant&entityId=${variant.id}`).expect(200)).body.rows;
    expect(events.map((event: { action: string }) => event.action)).toEqual(['update', 'status', 'status', 'create']);
    expect(events[0]).toMatchObject({ before: { notes: null, version: 3 }, after: { notes: 'sequenced twice', version: 4 } });
  });

  it('returns 409 stale_version for an old version and overwrites nothing', async () => {
    const variant = await register('W150F/D230Q');
    await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'cloned' }).expect(200);
    const stale = await as('lead').patch(`/api/variants/${variant.id}`, { version: variant.version, status: 'failed', notes: 'lost' }).expect(409);
    expect(stale.body.error).toMatchObject({ code: 'stale_version', currentVersion: 2 });
    expect((await as('viewer').get(`/api/variants/${variant.id}`).expect(200)).body).toMatchObject({ status: 'cloned', notes: null, version: 2 });
  });

  it('shows lineage both ways and refuses a loop, a self-parent and a parent for the campaign parent', async () => {
    const root = await register('S112T');
    const child = await register('S112T/H190Q', { parentVariantId: root.id });
    const grandchild = await register('S112T/H190Q/D230E', { parentVariantId: child.id });
    const rootView = (await as('viewer').get(`/api/variants/${root.id}`).expect(200)).body;
    expect(rootView.lineage).toEqual({ parent: null, children: [{ id: child.id, label: 'S112T/H190Q', status: 'designed' }], childCount: 1 });

    const loop = await as('biologist').patch(`/api/variants/${root.id}`, { version: root.version, parentVariantId: grandchild.id }).expect(400);
    expect(loop.body.error.fields).toEqual({ parentVariantId: `variant ${grandchild.id} descends from S112T; a lineage cannot loop` });
    const self = await as('biologist').patch(`/api/variants/${root.id}`, { version: root.version, parentVariantId: root.id }).expect(400);
    expect(self.body.error.fields).toEqual({ parentVariantId: 'cannot be the variant itself' });
    const parentOfParent = await as('biologist')
      .patch(`/api/variants/${campaign.parentVariantId}`, { version: 1, parentVariantId: root.id })
      .expect(400);
    expect(parentOfParent.body.error.fields.parentVariantId).toBe('the campaign’s parent variant is the root of its lineage and has no parent');

    const moved = (await as('biologist').patch(`/api/variants/${grandchild.id}`, { version: grandchild.version, parentVariantId: root.id }).expect(200)).body;
    expect(moved.lineage.parent.id).toBe(root.id);
    const cleared = (await as('biologist').patch(`/api/variants/${grandchild.id}`, { version: moved.version, parentVariantId: null }).expect(200)).body;
    expect(cleared.parentVariantId).toBeNull();
  });

  it('answers 404 for a missing variant and 400 for a bad id or an empty change', async () => {
    await as('viewer').get('/api/variants/999999').expect(404);
    await as('viewer').get('/api/variants/abc').expect(400);
    await as('biologist').patch('/api/variants/999999', { version: 1, status: 'cloned' }).expect(404);
    const empty = await as('biologist').patch(`/api/variants/${campaign.parentVariantId}`, { version: 1 }).expect(400);
    expect(empty.body.error.fields).toEqual({ status: 'give at least one of status, constructId, notes or parentVariantId to change' });
  });
});

describe('GET /api/variants (filters, sorts, pages)', () => {
  // A campaign of its own with known variants and summary numbers (SI units; ΔΔG‡ in kJ/mol).
  let listCampaign: { id: number; parentVariantId: number };
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    listCampaign = (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
    ids.parent = listCampaign.parentVariantId;
    const specs: [string, string, Record<string, unknown>][] = [
      ['A', 'S112A', { status: 'characterized' }],
      ['B', 'H190N', { status: 'characterized' }],
      ['C', 'S112A/H190N', { status: 'purified' }],
      ['D', 'W150F', { status: 'characterized', constructId: 'pKC-0150_F', notes: 'second shell, 50% yield' }],
      ['E', 'D230N', { status: 'expressed', constructId: 'pKC-0230' }],
      ['F', 'C45S', { status: 'failed' }],
      ['G', 'G11A', { status: 'designed', notes: 'filler position' }],
      ['H', 'W150A/D230N', { status: 'cloned' }],
    ];
    for (const [name, mutations, extra] of specs) ids[name] = (await register(mutations, extra, listCampaign.id)).id;
    const summary = (kcat: number, kmMolar: number, fold: number | null, ddg: number | null, se: number | null) => ({
      summaryKcat: kcat,
      summaryKm: kmMolar,
      summaryKcatOverKm: kcat / kmMolar,
      summaryFoldChange: fold,
      summaryDdgKjPerMol: ddg,
      summaryDdgSeKjPerMol: se,
      summaryMeasurementCount: 2,
      summaryCompleteness: 0.9,
    });
    await setVariantSummary(testApp.dataSource, ids.parent, summary(10, 1e-3, null, null, null));
    await setVariantSummary(testApp.dataSource, ids.A, { ...summary(0.001, 2e-3, 5e-5, 25.5, 0.4), summaryFlags: 'km_above_range,low_n' });
    await setVariantSummary(testApp.dataSource, ids.B, summary(2, 1e-3, 0.2, 4.1, 0.3));
    await setVariantSummary(testApp.dataSource, ids.D, summary(30, 1.5e-3, 2, -1.8, 0.2));
    await setVariantSummary(testApp.dataSource, ids.H, summary(5, 4e-3, 0.125, 5.4, 0.5));
    // Distinct update times, oldest first in this order.
    const updateOrder = ['G', 'F', 'E', 'C', 'parent', 'A', 'H', 'B', 'D'];
    for (const [index, name] of updateOrder.entries()) {
      await testApp.dataSource.query(`UPDATE variants SET updated_at = ? WHERE id = ?`, [`2030-01-01 00:00:${String(index).padStart(2, '0')}.000`, ids[name]]);
    }
  });

  const nameOf = (id: number) => Object.entries(ids).find(([, candidate]) => candidate === id)?.[0];

  async function listNames(query: string): Promise<string[]> {
    const response = await as('viewer').get(`/api/variants?campaignId=${listCampaign.id}&pageSize=500&${query}`).expect(200);
    expect(response.body.total).toBe(response.body.rows.length);
    return response.body.rows.map((row: { id: number }) => nameOf(row.id));
  }

  it('returns every variant of the campaign with its summary numbers in tagged units', async () => {
    const response = await as('viewer').get(`/api/variants?campaignId=${listCampaign.id}&sort=label`).expect(200);
    expect(response.body).toMatchObject({ total: 9, page: 1, pageSize: 50 });
    const a = response.body.rows.find((row: { id: number }) => row.id === ids.A);
    expect(a).toMatchObject({
      label: 'S112A',
      hgvs: 'p.Ser112Ala',
      mutations: [{ position: 112, from: 'S', to: 'A', roles: ['nucleophile'] }],
      status: 'characterized',
      kcat: { value: 0.001, unit: 's⁻¹' },
      km: { value: 0.002, unit: 'M' },
      kcatOverKm: { value: 0.5, unit: 'M⁻¹ s⁻¹' },
      foldChange: 5e-5,
      ddg: { value: 25.5, se: 0.4, unit: 'kJ/mol' },
      measurementCount: 2,
      completeness: 0.9,
      flags: ['km_above_range', 'low_n'],
      updatedAt: '2030-01-01T00:00:05.000Z',
    });
    expect(response.body.rows.find((row: { id: number }) => row.id === ids.E)).toMatchObject({ kcat: null, km: null, kcatOverKm: null, ddg: null, flags: [] });
  });

  it('filters by position, residue (parent or new) and catalytic role on one and the same mutated site', async () => {
    expect(await listNames('position=112&sort=label')).toEqual(['A', 'C']);
    expect(await listNames('position=112&residue=Ala&sort=label')).toEqual(['A', 'C']);
    // C carries Asn, but at 190, not at 112.
    expect(await listNames('position=112&residue=N')).toEqual([]);
    expect(await listNames('residue=N&sort=label')).toEqual(['E', 'B', 'C', 'H']);
    expect(await listNames('residue=W&sort=label')).toEqual(['H', 'D']);
    expect(await listNames('residue=s&sort=label')).toEqual(['F', 'A', 'C']);
    expect(await listNames('role=nucleophile&sort=label')).toEqual(['A', 'C']);
    expect(await listNames('role=general%20base&sort=label')).toEqual(['B', 'C']);
    expect(await listNames('role=electrostatic&sort=label')).toEqual(['E', 'H']);
    expect(await listNames('role=electrostatic&residue=A')).toEqual([]);
    expect(await listNames('role=substrate%20binding')).toEqual([]);
  });

  it('filters by status, fold change, ΔΔG‡ range and free text', async () => {
    expect(await listNames('status=characterized&sort=label')).toEqual(['B', 'A', 'D']);
    expect(await listNames('status=failed,designed&sort=label')).toEqual(['F', 'G']);
    expect(await listNames('status=failed&status=designed&sort=label')).toEqual(['F', 'G']);
    expect(await listNames('minFoldChange=1')).toEqual(['D']);
    expect(await listNames('minFoldChange=0.1&sort=foldChange')).toEqual(['H', 'B', 'D']);
    expect(await listNames('ddgMin=0&ddgMax=5')).toEqual(['B']);
    expect(await listNames('ddgMin=5&sort=ddg')).toEqual(['H', 'A']);
    expect(await listNames('ddgMax=0')).toEqual(['D']);
    expect(await listNames('q=pkc&sort=label')).toEqual(['E', 'D']);
    expect(await listNames('q=his190&sort=label')).toEqual(['B', 'C']);
    expect(await listNames('q=filler')).toEqual(['G']);
    // LIKE wildcards typed by the user are literal: '_' and '%' match only themselves.
    expect(await listNames('q=_')).toEqual(['D']);
    expect(await listNames('q=50%25')).toEqual(['D']);
    expect(await listNames('status=characterized&role=nucleophile&minFoldChange=0')).toEqual(['A']);
  });

  it('sorts by every key in both directions with nulls last', async () => {
    expect(await listNames('sort=kcat')).toEqual(['A', 'B', 'H', 'parent', 'D', 'C', 'E', 'F', 'G']);
    expect(await listNames('sort=kcat&order=desc')).toEqual(['D', 'parent', 'H', 'B', 'A', 'G', 'F', 'E', 'C']);
    // B and the parent tie on Km; ties go by id.
    expect(await listNames('sort=km')).toEqual(['parent', 'B', 'D', 'A', 'H', 'C', 'E', 'F', 'G']);
    expect(await listNames('sort=kcatOverKm&order=desc')).toEqual(['D', 'parent', 'B', 'H', 'A', 'G', 'F', 'E', 'C']);
    expect(await listNames('sort=foldChange&order=desc')).toEqual(['D', 'B', 'H', 'A', 'G', 'F', 'E', 'C', 'parent']);
    expect(await listNames('sort=ddg')).toEqual(['D', 'B', 'H', 'A', 'parent', 'C', 'E', 'F', 'G']);
    expect(await listNames('sort=ddg&order=desc')).toEqual(['A', 'H', 'B', 'D', 'G', 'F', 'E', 'C', 'parent']);
    expect(await listNames('sort=position')).toEqual(['G', 'F', 'A', 'C', 'D', 'H', 'B', 'E', 'parent']);
    expect(await listNames('sort=position&order=desc')).toEqual(['E', 'B', 'H', 'D', 'C', 'A', 'F', 'G', 'parent']);
    expect(await listNames('sort=label')).toEqual(['F', 'E', 'G', 'B', 'A', 'C', 'H', 'D', 'parent']);
    expect(await listNames('sort=label&order=desc')).toEqual(['parent', 'D', 'H', 'C', 'A', 'B', 'G', 'E', 'F']);
    expect(await listNames('')).toEqual(['D', 'B', 'H', 'A', 'parent', 'C', 'E', 'F', 'G']);
    expect(await listNames('sort=updated&order=asc')).toEqual(['G', 'F', 'E', 'C', 'parent', 'A', 'H', 'B', 'D']);
  });

  it('pages through a sort across the boundary between measured and unmeasured rows', async () => {
    const pages = async (query: string) => {
      const names: string[][] = [];
      for (let page = 1; page <= 4; page += 1) {
        const response = await as('viewer').get(`/api/variants?campaignId=${listCampaign.id}&${query}&pageSize=4&page=${page}`).expect(200);
        expect(response.body).toMatchObject({ total: 9, page, pageSize: 4 });
        names.push(response.body.rows.map((row: { id: number }) => nameOf(row.id)));
      }
      return names;
    };
    expect(await pages('sort=kcat')).toEqual([['A', 'B', 'H', 'parent'], ['D', 'C', 'E', 'F'], ['G'], []]);
    expect(await pages('sort=ddg&order=desc')).toEqual([['A', 'H', 'B', 'D'], ['G', 'F', 'E', 'C'], ['parent'], []]);
    expect(await pages('sort=label')).toEqual([['F', 'E', 'G', 'B'], ['A', 'C', 'H', 'D'], ['parent'], []]);
  });

  it('returns 400 with field messages for a bad query', async () => {
    const bad = await as('viewer').get('/api/variants?pageSize=501&page=0&sort=speed&order=up&residue=J&role=hinge&status=done&position=-1&ddgMin=x').expect(400);
    expect(bad.body.error.fields).toEqual({
      pageSize: 'must be a whole number from 1 to 500',
      page: 'must be a whole number from 1',
      sort: 'must be one of label, position, kcat, km, kcatOverKm, foldChange, ddg, updated',
      order: 'must be asc or desc',
      residue: "must be one amino acid such as A, Ala or * (stop), got 'J'",
      role: 'must be one of nucleophile, general acid, general base, acid/base, metal ligand, oxyanion hole, substrate binding, electrostatic, other',
      status: "'done' is not a status; use designed, cloned, sequence-verified, expressed, purified, characterized, failed, archived",
      position: 'must be a residue number from 1 to 50000',
      ddgMin: 'must be a number (kJ/mol)',
    });
    const range = await as('viewer').get('/api/variants?ddgMin=5&ddgMax=1').expect(400);
    expect(range.body.error.fields).toEqual({ ddgMax: 'must be at least ddgMin (5)' });
    const unknown = await as('viewer').get('/api/variants?campaign=1').expect(400);
    expect(unknown.body.error.fields._).toContain("unknown parameter 'campaign'");
    const twice = await as('viewer').get('/api/variants?position=1&position=2').expect(400);
    expect(twice.body.error.fields).toEqual({ position: 'must be given once' });
  });
});
