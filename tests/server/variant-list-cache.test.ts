import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { campaignBody, enzymeBody } from './registry-fixtures';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('GET /api/variants result cache', () => {
  it('never serves a page or count from before a write', async () => {
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const write = (path: string, body: object) => lead.agent.post(path).set('X-CSRF-Token', lead.csrfToken).send(body);
    const enzyme = (await write('/api/enzymes', enzymeBody()).expect(201)).body;
    const campaign = (await write('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    const view = `/api/variants?campaignId=${campaign.id}&sort=label&pageSize=10`;

    const before = (await lead.agent.get(view).expect(200)).body;
    expect((await lead.agent.get(view).expect(200)).body).toEqual(before);

    await write('/api/variants', { campaignId: campaign.id, mutations: 'H190N' }).expect(201);
    const after = (await lead.agent.get(view).expect(200)).body;
    expect(after.total).toBe(before.total + 1);
    expect(after.rows.map((row: { label: string }) => row.label)).toContain('H190N');
  });

  it('tags each page, answers an unchanged one with 304 Not Modified (RFC 9110 §13.1.2), and a changed one in full', async () => {
    const lead = await signedIn(testApp.app, demoEmail('lead'));
    const write = (path: string, body: object) => lead.agent.post(path).set('X-CSRF-Token', lead.csrfToken).send(body);
    const enzyme = (await write('/api/enzymes', enzymeBody()).expect(201)).body;
    const campaign = (await write('/api/campaigns', campaignBody(enzyme.id)).expect(201)).body;
    const view = `/api/variants?campaignId=${campaign.id}&sort=label&pageSize=10`;

    const first = await lead.agent.get(view).expect(200);
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^"[\w-]+"$/);
    await lead.agent.get(view).set('If-None-Match', etag).expect(304);

    await write('/api/variants', { campaignId: campaign.id, mutations: 'H190N' }).expect(201);
    const changed = await lead.agent.get(view).set('If-None-Match', etag).expect(200);
    expect(changed.headers.etag).not.toBe(etag);
    expect(changed.body.total).toBe(first.body.total + 1);
  });
});
