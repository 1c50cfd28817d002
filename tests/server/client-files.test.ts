import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { createTestApp, removeDataDir, testSecret, type TestApp } from './test-app';

let testApp: TestApp;
let app: Express;
const script = `export const rows = ${JSON.stringify(Array.from({ length: 500 }, (_, index) => ({ index, label: `row ${index}` })))};\n`;

beforeAll(async () => {
  testApp = await createTestApp();
  const clientDir = join(testApp.dataDir, 'client');
  mkdirSync(join(clientDir, 'assets'), { recursive: true });
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>Kcatalog</title><div id="root"></div>');
  writeFileSync(join(clientDir, 'assets', 'registry-Ab12Cd34.js'), script);
  app = createApp(testApp.dataSource, { sessionSecret: testSecret, clientDir });
});

afterAll(async () => {
  (app.locals.sessionStore as { close: () => void }).close();
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('the built client', () => {
  it('sends hashed assets compressed and cacheable for a year (RFC 9111 §5.2.2.1; immutable: RFC 8246)', async () => {
    const response = await request(app).get('/assets/registry-Ab12Cd34.js').set('Accept-Encoding', 'gzip').expect(200);
    expect(response.headers['content-encoding']).toBe('gzip');
    expect(response.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(response.text).toBe(script);
  });

  it('answers a missing asset with 404, not with the client page', async () => {
    const response = await request(app).get('/assets/registry-OldBuild.js').expect(404);
    expect(response.body.error.code).toBe('not_found');
  });

  it('serves the client page for client routes, and leaves API answers uncompressed', async () => {
    expect((await request(app).get('/registry?campaignId=1').expect(200)).text).toContain('<div id="root">');
    const health = await request(app).get('/api/health').set('Accept-Encoding', 'gzip').expect(200);
    expect(health.headers['content-encoding']).toBeUndefined();
  });
});
