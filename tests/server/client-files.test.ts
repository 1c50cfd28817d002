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
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><html><head><title>Kcatalog</title></head><body><div id="root"></div></body></html>');
  writeFileSync(join(clientDir, 'assets', 'registry-Ab12Cd34.js'), script);
  // The shape of Vite's build manifest (vite.dev/guide/backend-integration), cut down to a few chunks.
  mkdirSync(join(clientDir, '.vite'));
  writeFileSync(
    join(clientDir, '.vite', 'manifest.json'),
    JSON.stringify({
      'index.html': { file: 'assets/index-Main1234.js', isEntry: true, imports: ['_react-Shared12.js'], assets: ['assets/sans-latin-wght-normal-Font1234.woff2', 'assets/sans-latin-ext-wght-normal-Font5678.woff2'] },
      '_react-Shared12.js': { file: 'assets/react-Shared12.js' },
      '_grid-Grid1234.js': { file: 'assets/grid-Grid1234.js', imports: ['_react-Shared12.js'] },
      'src/features/registry/api/prefetch-registry.ts': { file: 'assets/prefetch-registry-Pre12345.js', isDynamicEntry: true, imports: ['index.html'] },
      'src/app/routes/registry.tsx': { file: 'assets/registry-Ab12Cd34.js', isDynamicEntry: true, imports: ['index.html', '_grid-Grid1234.js'] },
      'src/app/routes/variant.tsx': { file: 'assets/variant-Var12345.js', isDynamicEntry: true, imports: ['index.html'] },
    }),
  );
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

  it("names the route's own chunks and the first fonts in the page, not the main bundle's (modulepreload: HTML Living Standard §4.6.7)", async () => {
    const registry = (await request(app).get('/registry?sort=ddg').expect(200)).text;
    const preloaded = [...registry.matchAll(/<link rel="modulepreload" href="([^"]+)">/g)].map((found) => found[1]);
    expect(preloaded.sort()).toEqual(['/assets/grid-Grid1234.js', '/assets/prefetch-registry-Pre12345.js', '/assets/registry-Ab12Cd34.js']);
    expect(registry).toContain('<link rel="preload" href="/assets/sans-latin-wght-normal-Font1234.woff2" as="font" type="font/woff2" crossorigin>');
    expect(registry).not.toContain('latin-ext');

    expect((await request(app).get('/variants/12').expect(200)).text).toContain('<link rel="modulepreload" href="/assets/variant-Var12345.js">');
    const other = (await request(app).get('/no-such-page').expect(200)).text;
    expect(other).not.toContain('modulepreload');
    expect(other).toContain('as="font"');
    expect((await request(app).get('/registry').expect(200)).headers['cache-control']).toBe('no-cache');
  });

  it('does not serve the build manifest', async () => {
    expect((await request(app).get('/.vite/manifest.json').expect(200)).text).toContain('<div id="root">');
  });
});
