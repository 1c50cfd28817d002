import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '@server/data-source';
import { seedDemoIfEmpty } from '@server/seed/seed';
import { seededRandom } from '@server/seed/seeded-random';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

// Every write route with ids that exist in the demo campaign, that do not exist, and that are no ids at all.
const routes: [method: 'post' | 'patch' | 'put' | 'delete', path: string][] = [
  ['post', '/api/enzymes'], ['patch', '/api/enzymes/:id'], ['post', '/api/enzymes/:id/sites'], ['delete', '/api/enzymes/:id/sites/:id'],
  ['post', '/api/enzymes/fasta'], ['post', '/api/campaigns'], ['patch', '/api/campaigns/:id'], ['post', '/api/variants'],
  ['patch', '/api/variants/:id'], ['post', '/api/assays'], ['post', '/api/assays/:id/refit'], ['post', '/api/measurements'],
  ['post', '/api/measurements/:id/review'], ['post', '/api/measurements/review'], ['post', '/api/ph-profiles'],
  ['post', '/api/fits/michaelis-menten'], ['post', '/api/fits/substrate-inhibition'], ['post', '/api/fits/hill'], ['post', '/api/fits/ph-profile'],
  ['post', '/api/users'], ['patch', '/api/users/:id'], ['patch', '/api/auth/preferences'], ['post', '/api/invitations'],
  ['post', '/api/invitations/:id/revoke'], ['post', '/api/invitations/accept'], ['post', '/api/password-resets/complete'],
  ['put', '/api/digests/campaigns/:id/settings'], ['put', '/api/digests/campaigns/:id/subscription'], ['post', '/api/imports/:id/preview'],
  ['post', '/api/imports/:id/commit'],
];

const fieldNames = [
  'variantId', 'campaignId', 'enzymeId', 'substrate', 'temperatureC', 'ph', 'buffer', 'enzymeConcentration', 'points', 'sUnit', 'vUnit',
  'model', 'mutations', 'name', 'sequence', 'ecNumber', 'sites', 'position', 'residue', 'role', 'version', 'action', 'reason', 'items', 'email',
  'password', 'status', 'kcat', 'km', 'value', 'unit', 'se', 'fasta', 'notes', 'objective', 'targetPh', 'targetTemperatureC', 'leadId', 'mode',
  'columns', 'sheet', 'ids', 'excluded', 'series', 'rates', 'energyUnit', 'weekday', 'hour', 'timeZone', 'token', 'id', 'replicate', 's', 'v',
];

function weirdValue(random: ReturnType<typeof seededRandom>, depth: number): unknown {
  const pick = Math.floor(random.uniform() * 16);
  switch (pick) {
    case 0: return null;
    case 1: return random.uniform() < 0.5;
    case 2: return -1;
    case 3: return 0;
    case 4: return 1e308;
    case 5: return 2 ** 53 + 1;
    case 6: return random.uniform() * 100 - 50;
    case 7: return '';
    case 8: return 'x'.repeat(5000);
    case 9: return 'C112A/H190N';
    case 10: return '__proto__';
    case 11: return '1; DROP TABLE variants';
    case 12: return depth > 2 ? [] : Array.from({ length: 3 }, () => weirdValue(random, depth + 1));
    case 13: return depth > 2 ? {} : weirdObject(random, depth + 1);
    case 14: return { value: weirdValue(random, depth + 1), unit: random.pick(['mM', 'µM', '1/s', 'nM', 'parsec', '']) };
    default: return [{ s: weirdValue(random, depth + 1), v: weirdValue(random, depth + 1) }];
  }
}

function weirdObject(random: ReturnType<typeof seededRandom>, depth: number): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  const count = 1 + Math.floor(random.uniform() * 6);
  for (let index = 0; index < count; index += 1) body[random.pick(fieldNames)] = weirdValue(random, depth);
  return body;
}

let testApp: TestApp;

beforeAll(async () => {
  // The demo campaign first (it seeds only an empty database), so the ids below name real rows.
  const dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-fuzz-'));
  const seeding = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  await seedDemoIfEmpty(seeding);
  await seeding.destroy();
  testApp = await createTestApp(dataDir);
}, 120_000);

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('bad input of any kind', () => {
  it('never makes a write route fail with a server error (2,000 generated requests, fixed seed)', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const random = seededRandom(4_242);
    const ids = ['1', '2', '7', '999999', 'abc', '-3', '1.5', '%00'];
    const failures: string[] = [];
    for (let index = 0; index < 2000; index += 1) {
      const [method, template] = routes[index % routes.length];
      const path = template.replace(/:id/g, () => random.pick(ids));
      const body = random.uniform() < 0.1 ? weirdValue(random, 0) : weirdObject(random, 0);
      const response = await admin.agent[method](path).set('X-CSRF-Token', admin.csrfToken).set('Content-Type', 'application/json').send(JSON.stringify(body));
      if (response.status >= 500) failures.push(`${method.toUpperCase()} ${path} ${JSON.stringify(body).slice(0, 200)} → ${response.status} ${response.text.slice(0, 200)}`);
    }
    expect(failures).toEqual([]);
    await admin.agent.get('/api/health').expect(200);
  }, 300_000);

  it('answers a valid request with one field spoilt by a 4xx that writes nothing, or by success (4,400 requests, fixed seed)', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const random = seededRandom(1_201);
    const [{ id: variantId }] = await testApp.dataSource.query(`SELECT id FROM variants WHERE mutation_count = 0 LIMIT 1`);
    const [{ id: enzymeId }] = await testApp.dataSource.query(`SELECT id FROM enzymes LIMIT 1`);
    // Valid bodies of the main writes; the values are invented.
    const conditions = { variantId, substrate: 'invented anilide', temperatureC: 37, ph: 6, buffer: { name: 'MES', concentration: { value: 50, unit: 'mM' } }, assayDate: '2026-03-02' };
    const points = [0.05, 0.1, 0.2, 0.5, 1, 2, 5].map((s, index) => ({ s, v: (10 * s) / (0.4 + s) + (index % 2) * 0.05, replicate: 1 }));
    const [variant] = await testApp.dataSource.query(`SELECT id, version FROM variants WHERE mutation_count = 1 LIMIT 1`);
    const [campaign] = await testApp.dataSource.query(`SELECT id, version, enzyme_id AS enzymeId FROM campaigns LIMIT 1`);
    // Two measurements, one reviewed alone and one in bulk, so that one base's success does not make the other's version stale.
    const [measurement, bulkMeasurement] = await testApp.dataSource.query(`SELECT id, version FROM measurements WHERE review_state = 'submitted' LIMIT 2`);
    const [{ sequence }] = await testApp.dataSource.query(`SELECT sequence FROM enzymes WHERE id = ?`, [enzymeId]);
    const annotated = new Set((await testApp.dataSource.query(`SELECT position FROM catalytic_sites WHERE enzyme_id = ?`, [enzymeId])).map((site: { position: number }) => site.position));
    // A new unannotated position each time, so a site that went through does not make the next one a duplicate.
    let lastPosition = 1;
    const siteBody = () => {
      do lastPosition += 1;
      while (annotated.has(lastPosition));
      return { position: lastPosition, residue: sequence[lastPosition - 1], role: 'substrate binding' };
    };
    // The current version, so that a spoilt request that still went through does not make the rest stale.
    const versionOf = async (table: string, id: number) => Number((await testApp.dataSource.query(`SELECT version FROM ${table} WHERE id = ?`, [id]))[0].version);
    type Body = Record<string, unknown>;
    const bases: [method: 'post' | 'patch', path: string, body: Body | (() => Body | Promise<Body>)][] = [
      ['patch', `/api/variants/${variant.id}`, async () => ({ version: await versionOf('variants', variant.id), status: 'expressed', notes: 'checked' })],
      ['patch', `/api/campaigns/${campaign.id}`, async () => ({ version: await versionOf('campaigns', campaign.id), targetPh: 5.5, objective: 'more acid tolerance' })],
      ['post', '/api/campaigns', { name: 'fuzz campaign', objective: 'o', enzymeId: campaign.enzymeId, targetSubstrate: 'invented anilide', targetPh: 6, targetTemperatureC: 40 }],
      ['post', `/api/measurements/${measurement.id}/review`, { version: measurement.version, action: 'flag', reason: 'odd curve' }],
      ['post', '/api/measurements/review', { items: [{ id: bulkMeasurement.id, version: bulkMeasurement.version }], action: 'approve', reason: 'fine' }],
      ['post', '/api/assays', { ...conditions, enzymeConcentration: { value: 10, unit: 'nM' }, points, sUnit: 'mM', vUnit: 'µM/min', model: 'michaelis-menten' }],
      ['post', '/api/measurements', { ...conditions, kcat: { value: 600, se: 30, unit: '1/min' }, km: { value: 1, se: 0.1, unit: 'mM' } }],
      ['post', '/api/ph-profiles', { variantId, substrate: 'invented anilide', temperatureC: 37, rateKind: 'kcatOverKm', unit: 'mM⁻¹ s⁻¹', model: 'bell', points: [4, 5, 6, 7, 8, 9].map((ph) => ({ ph, k: 50 / (1 + 10 ** (5 - ph) + 10 ** (ph - 8)) })) }],
      ['post', '/api/fits/michaelis-menten', { points: points.map(({ s, v }) => ({ s, v })), enzymeConcentration: 1e-8 }],
      ['post', '/api/variants', { campaignId: 1, mutations: 'Y87F/W160F', notes: 'fuzz' }],
      ['post', `/api/enzymes/${enzymeId}/sites`, siteBody],
    ];
    const tables = ['assays', 'rate_points', 'measurements', 'ph_profiles', 'variants', 'mutations', 'catalytic_sites', 'campaigns', 'audit_events'];
    const counts = async () => Promise.all(tables.map(async (table) => Number((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)));
    const spoil = (value: unknown, depth: number): unknown => {
      if (Array.isArray(value) && value.length > 0 && random.uniform() < 0.6) {
        const copy = [...value];
        copy[Math.floor(random.uniform() * copy.length)] = spoil(copy[Math.floor(random.uniform() * copy.length)], depth + 1);
        return copy;
      }
      if (value && typeof value === 'object' && !Array.isArray(value) && random.uniform() < 0.6) {
        const copy: Record<string, unknown> = { ...(value as Record<string, unknown>) };
        const key = random.pick(Object.keys(copy));
        if (random.uniform() < 0.15) delete copy[key];
        else copy[key] = spoil(copy[key], depth + 1);
        return copy;
      }
      return weirdValue(random, 2);
    };
    const send = (method: 'post' | 'patch', path: string, body: unknown) =>
      admin.agent[method](path).set('X-CSRF-Token', admin.csrfToken).set('Content-Type', 'application/json').send(JSON.stringify(body));
    // Each base as it is goes through, so the spoilt ones below are one change away from a valid request.
    const unspoilt = [];
    for (const [method, path, base] of bases) unspoilt.push(`${method} ${path} ${(await send(method, path, typeof base === 'function' ? await base() : base)).status}`);
    expect(unspoilt.filter((line) => !/ 20[01]$/.test(line))).toEqual([]);
    const failures: string[] = [];
    for (let index = 0; index < 4400; index += 1) {
      const [method, path, base] = bases[index % bases.length];
      const body = spoil(typeof base === 'function' ? await base() : base, 0);
      const before = await counts();
      const response = await send(method, path, body);
      const request = `${method.toUpperCase()} ${path} ${JSON.stringify(body).slice(0, 300)} → ${response.status} ${response.text.slice(0, 200)}`;
      if (response.status >= 500) failures.push(request);
      else if (response.status >= 400 && (await counts()).some((count, table) => count !== before[table])) failures.push(`wrote rows: ${request}`);
    }
    expect(failures).toEqual([]);
  }, 600_000);
});
