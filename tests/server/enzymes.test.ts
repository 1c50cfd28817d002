import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/permissions';
import { inventedSequence } from '../factories';
import { campaignBody, enzymeBody, parentSequence, uniqueName } from './registry-fixtures';
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

async function createEnzyme(overrides: Record<string, unknown> = {}) {
  const response = await as('biologist').post('/api/enzymes', enzymeBody(overrides)).expect(201);
  return response.body;
}

async function auditFor(entityType: string, entityId: number) {
  const response = await as('viewer').get(`/api/audit?entityType=${entityType}&entityId=${entityId}`).expect(200);
  return response.body.rows as { action: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null; actor: { name: string } | null }[];
}

describe('role × route matrix for /api/enzymes', () => {
  const writers: Role[] = ['admin', 'lead', 'biologist'];
  const refused: Role[] = ['kineticist', 'viewer'];

  it.each(refused)('returns 403 for a %s on every enzyme write', async (role) => {
    const enzyme = await createEnzyme();
    const client = as(role);
    await client.post('/api/enzymes', enzymeBody()).expect(403);
    await client.patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, organism: 'other' }).expect(403);
    await client.post(`/api/enzymes/${enzyme.id}/sites`, { position: 150, residue: 'W', role: 'substrate binding' }).expect(403);
    await client.delete(`/api/enzymes/${enzyme.id}/sites/${enzyme.sites[0].id}`).expect(403);
    await client.post('/api/enzymes/fasta', { fasta: '>x\nMKV\n' }).expect(403);
    const after = (await client.get(`/api/enzymes/${enzyme.id}`).expect(200)).body;
    expect(after).toMatchObject({ version: enzyme.version, organism: enzyme.organism, siteCount: enzyme.siteCount });
  });

  it.each(writers)('lets a %s create, edit and annotate enzymes', async (role) => {
    const client = as(role);
    const enzyme = (await client.post('/api/enzymes', enzymeBody()).expect(201)).body;
    await client.patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, organism: 'synthetic construct, codon-optimised' }).expect(200);
    const site = (await client.post(`/api/enzymes/${enzyme.id}/sites`, { position: 150, residue: 'Trp', role: 'substrate binding' }).expect(201)).body;
    await client.delete(`/api/enzymes/${enzyme.id}/sites/${site.id}`).expect(204);
    await client.post('/api/enzymes/fasta', { fasta: '>x\nMKV\n' }).expect(200);
  });

  it.each(['admin', 'lead', 'kineticist', 'biologist', 'viewer'] as Role[])('lets a %s read enzymes and sites', async (role) => {
    const enzyme = await createEnzyme();
    const client = as(role);
    const list = (await client.get('/api/enzymes').expect(200)).body;
    expect(list.rows.some((row: { id: number }) => row.id === enzyme.id)).toBe(true);
    await client.get(`/api/enzymes/${enzyme.id}`).expect(200);
    await client.get(`/api/enzymes/${enzyme.id}/sites`).expect(200);
  });

  it('returns 401 when signed out', async () => {
    await request(testApp.app).get('/api/enzymes').expect(401);
    await request(testApp.app).get('/api/enzymes/1/sites').expect(401);
  });
});

describe('POST /api/enzymes', () => {
  it('creates an enzyme with its sites and records the creation', async () => {
    const enzyme = await createEnzyme({ ecNumber: 'EC 3.5.1.4', accession: 'q9zzz1' });
    expect(enzyme).toMatchObject({
      ecNumber: '3.5.1.4',
      accession: 'Q9ZZZ1',
      sequence: parentSequence,
      sequenceLength: 300,
      cofactors: ['Zn2+'],
      siteCount: 4,
      campaignCount: 0,
      version: 1,
    });
    expect(enzyme.sites.map((site: { position: number; role: string }) => `${site.position} ${site.role}`)).toEqual([
      '45 metal ligand',
      '112 nucleophile',
      '190 general base',
      '230 electrostatic',
    ]);
    const [event] = await auditFor('enzyme', enzyme.id);
    expect(event).toMatchObject({ action: 'create', before: null, actor: { name: 'Daniel Achterberg' } });
    expect(event.after).toMatchObject({ name: enzyme.name, sequence: parentSequence });
    expect((event.after as { sites: unknown[] }).sites).toHaveLength(4);
  });

  it('stores the sites\' notes given with a new enzyme and returns them', async () => {
    const sites = [
      { position: 112, residue: 'S', role: 'nucleophile', note: '  Attacks the carbonyl  ' },
      { position: 190, residue: 'H', role: 'general base' },
    ];
    const enzyme = await createEnzyme({ sites });
    expect(enzyme.sites.map((site: { position: number; note: string | null }) => [site.position, site.note])).toEqual([
      [112, 'Attacks the carbonyl'],
      [190, null],
    ]);
    const listed = (await as('viewer').get(`/api/enzymes/${enzyme.id}/sites`).expect(200)).body;
    expect(listed.rows.map((site: { note: string | null }) => site.note)).toEqual(['Attacks the carbonyl', null]);
  });

  it('returns 400 for a site note over 500 characters, and writes nothing', async () => {
    const name = uniqueName('Long note');
    const response = await as('biologist')
      .post('/api/enzymes', enzymeBody({ name, sites: [{ position: 190, residue: 'H', role: 'general base', note: 'n'.repeat(501) }] }))
      .expect(400);
    expect(response.body.error.fields).toEqual({ 'sites.0.note': 'must be at most 500 characters' });
    const list = (await as('viewer').get('/api/enzymes').expect(200)).body;
    expect(list.rows.some((row: { name: string }) => row.name === name)).toBe(false);
  });

  it('returns 400 naming a site that does not match the sequence, and writes nothing', async () => {
    const name = uniqueName('Mismatched');
    const response = await as('biologist')
      .post('/api/enzymes', enzymeBody({ name, sites: [{ position: 112, residue: 'C', role: 'nucleophile' }] }))
      .expect(400);
    expect(response.body.error.fields).toEqual({ 'sites.0.residue': 'position 112 of the sequence is Ser, not Cys' });
    const list = (await as('viewer').get('/api/enzymes').expect(200)).body;
    expect(list.rows.some((row: { name: string }) => row.name === name)).toBe(false);
  });

  it('returns 409 for a name that is taken, in any case', async () => {
    const enzyme = await createEnzyme();
    const response = await as('biologist').post('/api/enzymes', enzymeBody({ name: enzyme.name.toUpperCase() })).expect(409);
    expect(response.body.error).toMatchObject({ code: 'conflict', existingEnzymeId: enzyme.id });
  });
});

describe('PATCH /api/enzymes/:id', () => {
  it('returns 409 stale_version for an old version and overwrites nothing', async () => {
    const enzyme = await createEnzyme();
    const changed = (await as('biologist').patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, organism: 'first edit' }).expect(200)).body;
    expect(changed.version).toBe(enzyme.version + 1);
    const stale = await as('lead').patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, organism: 'second edit' }).expect(409);
    expect(stale.body.error).toMatchObject({ code: 'stale_version', currentVersion: changed.version });
    const after = (await as('viewer').get(`/api/enzymes/${enzyme.id}`).expect(200)).body;
    expect(after).toMatchObject({ organism: 'first edit', version: changed.version });
    const events = await auditFor('enzyme', enzyme.id);
    expect(events.map((event) => event.action)).toEqual(['update', 'create']);
    expect(events[0].before).toMatchObject({ organism: 'synthetic construct' });
    expect(events[0].after).toMatchObject({ organism: 'first edit' });
  });

  it('refuses a sequence that an annotated site or a registered variant would no longer match, naming them', async () => {
    const enzyme = await createEnzyme();
    const campaign = (await as('lead').post('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112A' }).expect(201);
    await as('biologist').post('/api/variants', { campaignId: campaign.id, mutations: 'S112T/H190N' }).expect(201);
    // Ser112 becomes Gly: the nucleophile annotation and both variants at 112 would point at the wrong residue.
    const changedSequence = `${parentSequence.slice(0, 111)}G${parentSequence.slice(112)}`;
    const response = await as('biologist').patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, sequence: changedSequence }).expect(400);
    expect(response.body.error.fields.sequence).toContain('catalytic site Ser112 (nucleophile): position 112 of the new sequence is Gly, not Ser');
    expect(response.body.error.fields.sequence).toContain('2 variants (S112A, S112T/H190N): position 112 of the new sequence is Gly, not Ser');
    expect(response.body.error.sequenceConflicts.mutations).toEqual([
      { position: 112, from: 'S', variantCount: 2, examples: ['S112A', 'S112T/H190N'], message: 'position 112 of the new sequence is Gly, not Ser' },
    ]);
    const after = (await as('viewer').get(`/api/enzymes/${enzyme.id}`).expect(200)).body;
    expect(after).toMatchObject({ sequence: parentSequence, version: enzyme.version });
  });

  it('refuses a shortened sequence that cuts off an annotated site', async () => {
    const enzyme = await createEnzyme();
    const response = await as('biologist')
      .patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, sequence: parentSequence.slice(0, 200) })
      .expect(400);
    expect(response.body.error.fields.sequence).toContain(
      'catalytic site Asp230 (electrostatic): position 230 is beyond the new sequence (200 residues)',
    );
  });

  it('accepts a new sequence that everything still matches', async () => {
    const enzyme = await createEnzyme();
    const extended = `${parentSequence}GSHHHHHH`;
    const changed = (await as('biologist').patch(`/api/enzymes/${enzyme.id}`, { version: enzyme.version, sequence: extended.toLowerCase() }).expect(200)).body;
    expect(changed).toMatchObject({ sequence: extended, sequenceLength: 308 });
  });

  it('answers 404 for a missing enzyme and 400 for a bad id or body', async () => {
    await as('biologist').patch('/api/enzymes/999999', { version: 1, organism: 'x' }).expect(404);
    await as('biologist').patch('/api/enzymes/abc', { version: 1, organism: 'x' }).expect(400);
    const response = await as('biologist').patch('/api/enzymes/1', { version: 1, ecNumber: '9.1.1.1' }).expect(400);
    expect(response.body.error.fields.ecNumber).toBe('EC class must be 1 to 7 (the first part), got 9');
  });
});

describe('/api/enzymes/:id/sites', () => {
  it('adds a site that matches the sequence and records it', async () => {
    const enzyme = await createEnzyme();
    const site = (await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 150, residue: 'Trp', role: 'substrate binding', note: 'second shell' }).expect(201)).body;
    expect(site).toMatchObject({ enzymeId: enzyme.id, position: 150, residue: 'W', role: 'substrate binding', expectedPka: null, note: 'second shell' });
    const sites = (await as('viewer').get(`/api/enzymes/${enzyme.id}/sites`).expect(200)).body;
    expect(sites.rows.map((row: { position: number }) => row.position)).toEqual([45, 112, 150, 190, 230]);
    const [event] = await auditFor('catalytic-site', site.id);
    expect(event).toMatchObject({ action: 'create', after: { position: 150, residue: 'W' } });
  });

  it('refuses a residue the sequence does not have there, with the residue named, and writes nothing', async () => {
    const enzyme = await createEnzyme();
    const response = await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 112, residue: 'C', role: 'oxyanion hole' }).expect(400);
    expect(response.body.error.fields).toEqual({ residue: 'position 112 of the sequence is Ser, not Cys' });
    const beyond = await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 301, residue: 'G', role: 'other' }).expect(400);
    expect(beyond.body.error.fields).toEqual({ position: 'position 301 is beyond the sequence (300 residues)' });
    const sites = (await as('viewer').get(`/api/enzymes/${enzyme.id}/sites`).expect(200)).body;
    expect(sites.total).toBe(4);
  });

  it('returns 409 for a position already annotated with the same role', async () => {
    const enzyme = await createEnzyme();
    const response = await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 112, residue: 'S', role: 'nucleophile' }).expect(409);
    expect(response.body.error.existingSiteId).toBe(enzyme.sites[1].id);
    // The same residue in a second role is a separate annotation.
    await as('biologist').post(`/api/enzymes/${enzyme.id}/sites`, { position: 112, residue: 'S', role: 'oxyanion hole' }).expect(201);
  });

  it('deletes a site, records what it was, and answers 404 for a site of another enzyme', async () => {
    const enzyme = await createEnzyme();
    const other = await createEnzyme();
    await as('biologist').delete(`/api/enzymes/${other.id}/sites/${enzyme.sites[0].id}`).expect(404);
    await as('biologist').delete(`/api/enzymes/${enzyme.id}/sites/${enzyme.sites[0].id}`).expect(204);
    const sites = (await as('viewer').get(`/api/enzymes/${enzyme.id}/sites`).expect(200)).body;
    expect(sites.total).toBe(3);
    const [event] = await auditFor('catalytic-site', enzyme.sites[0].id);
    expect(event).toMatchObject({ action: 'delete', before: { position: 45, role: 'metal ligand' }, after: null });
  });

  it('answers 404 for the sites of a missing enzyme', async () => {
    await as('viewer').get('/api/enzymes/999999/sites').expect(404);
    await as('biologist').post('/api/enzymes/999999/sites', { position: 1, residue: 'G', role: 'other' }).expect(404);
  });
});

describe('POST /api/enzymes/fasta', () => {
  const threeRecords = [
    '>amd-a invented amidase, form A',
    inventedSequence(70),
    inventedSequence(50),
    '',
    '>amd-b invented amidase, form B',
    'MKVLAGTEQS NWFPYGLKTH',
    '>amd-c',
    'mkvlagteqs*',
  ].join('\r\n');

  it('returns every record of an uploaded file so the client can pick one', async () => {
    const response = await as('biologist')
      .session.agent.post('/api/enzymes/fasta')
      .set('X-CSRF-Token', as('biologist').session.csrfToken)
      .attach('file', Buffer.from(threeRecords, 'utf8'), { filename: 'amidases.fasta', contentType: 'application/octet-stream' })
      .expect(200);
    expect(response.body.records).toEqual([
      { header: 'amd-a invented amidase, form A', id: 'amd-a', description: 'invented amidase, form A', sequence: inventedSequence(70) + inventedSequence(50), length: 120 },
      { header: 'amd-b invented amidase, form B', id: 'amd-b', description: 'invented amidase, form B', sequence: 'MKVLAGTEQSNWFPYGLKTH', length: 20 },
      { header: 'amd-c', id: 'amd-c', description: '', sequence: 'MKVLAGTEQS', length: 10 },
    ]);
  });

  it('accepts the same text as JSON', async () => {
    const response = await as('biologist').post('/api/enzymes/fasta', { fasta: threeRecords }).expect(200);
    expect(response.body.records.map((record: { id: string }) => record.id)).toEqual(['amd-a', 'amd-b', 'amd-c']);
  });

  it('refuses a record with a residue that is not a standard amino acid', async () => {
    const response = await as('biologist').post('/api/enzymes/fasta', { fasta: '>bad\nMKVXL\n' }).expect(400);
    expect(response.body.error.fields.fasta).toBe(
      "record 'bad': residue 4 is 'X': an unspecified amino acid (X); every position must be one of the 20 standard amino acids",
    );
  });

  it('refuses a binary file, a file over 1 MB, a wrong field and an empty request', async () => {
    const client = as('biologist').session;
    const binary = await client.agent
      .post('/api/enzymes/fasta')
      .set('X-CSRF-Token', client.csrfToken)
      .attach('file', Buffer.from([0x3e, 0x61, 0x00, 0x01, 0x02]), 'enzyme.fasta')
      .expect(400);
    expect(binary.body.error.fields).toEqual({ file: 'is not a text file (FASTA is plain text)' });

    const latin1 = await client.agent
      .post('/api/enzymes/fasta')
      .set('X-CSRF-Token', client.csrfToken)
      .attach('file', Buffer.from([0x3e, 0xe9, 0x0a, 0x4d]), 'enzyme.fasta')
      .expect(400);
    expect(latin1.body.error.fields).toEqual({ file: 'is not UTF-8 text (FASTA is plain text)' });

    const large = `>big\n${'GASTVLKEDR\n'.repeat(100_000)}`;
    const tooLarge = await client.agent
      .post('/api/enzymes/fasta')
      .set('X-CSRF-Token', client.csrfToken)
      .attach('file', Buffer.from(large), 'big.fasta')
      .expect(413);
    expect(tooLarge.body.error.code).toBe('payload_too_large');

    const wrongField = await client.agent
      .post('/api/enzymes/fasta')
      .set('X-CSRF-Token', client.csrfToken)
      .attach('sequence', Buffer.from('>a\nMKV\n'), 'a.fasta')
      .expect(400);
    expect(wrongField.body.error.fields).toEqual({ file: 'upload one file in the field "file"' });

    const malformed = await client.agent
      .post('/api/enzymes/fasta')
      .set('X-CSRF-Token', client.csrfToken)
      .set('Content-Type', 'multipart/form-data; boundary=kcatalog')
      .send('--kcatalog\r\nContent-Disposition: form-data; name="file"; filename="a.fasta"\r\n\r\n>a\nMKV')
      .expect(400);
    expect(malformed.body.error.fields).toEqual({ file: 'could not be read' });

    const empty = await as('biologist').post('/api/enzymes/fasta', {}).expect(400);
    expect(Object.keys(empty.body.error.fields)).toEqual(['fasta']);
  });
});
