import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { maxAttachmentBytes } from '@shared/schemas/attachment';
import { createApp } from '@server/app';
import { openDatabase } from '@server/data-source';
import { Assay } from '@server/modules/assays/assay.entity';
import type { DatabaseSessionStore } from '@server/modules/sessions/database-session-store';
import { seedDemoAccounts } from '@server/seed/demo-accounts';
import { createCampaignWithParent, createEnzymeRow } from '../factories';
import { demoEmail, removeDataDir, signedIn, testSecret } from './test-app';

// FIPS 180-4 / NIST CSRC example values: SHA-256("abc").
const SHA256_OF_ABC = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

const csvExport = Buffer.from('Well,Time (s),A405\nA1,0,0.051\nA1,30,0.112\n', 'utf8');
// The first bytes of a ZIP container (local file header signature), as an .xlsx starts.
const xlsxLike = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(60, 1)]);

let dataDir: string;
let dataSource: DataSource;
let app: Express;
let assayId: number;
let otherAssayId: number;

async function createAssayRow(variantId: number): Promise<number> {
  const assay = await dataSource.getRepository(Assay).save(
    dataSource.getRepository(Assay).create({
      variantId,
      substrate: 'invented anilide',
      temperatureK: 310.15,
      ph: 6,
      assayDate: '2026-03-02',
      replicateCount: 1,
    }),
  );
  return assay.id;
}

async function counts() {
  const count = async (sql: string) => ((await dataSource.query(sql)) as { n: number }[])[0].n;
  return {
    rows: await count('SELECT COUNT(*) AS n FROM attachments'),
    audit: await count(`SELECT COUNT(*) AS n FROM audit_events WHERE entity_type = 'attachment'`),
    files: storedFiles().length,
  };
}

function storedFiles(): string[] {
  const root = join(dataDir, 'attachments');
  if (!existsSync(root)) return [];
  return readdirSync(root, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name));
}

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-attachments-'));
  dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  await seedDemoAccounts(dataSource);
  app = createApp(dataSource, { sessionSecret: testSecret, dataDir });
  const enzyme = await createEnzymeRow(dataSource);
  const { parent } = await createCampaignWithParent(dataSource, { enzyme });
  assayId = await createAssayRow(parent.id);
  otherAssayId = await createAssayRow(parent.id);
});

afterAll(async () => {
  (app.locals.sessionStore as DatabaseSessionStore).close();
  await dataSource.destroy();
  removeDataDir(dataDir);
});

describe('POST /api/assays/:id/attachments', () => {
  it('stores a plate-reader export under the data folder with its SHA-256, and serves it back as a download', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const response = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', csvExport, { filename: 'Platte µ-Assay 2026-03-02.csv', contentType: 'application/octet-stream' })
      .expect(201);
    const [attachment] = response.body.attachments;
    expect(attachment.originalName).toBe('Platte µ-Assay 2026-03-02.csv');
    // The type comes from the extension and the content, not from what the browser claimed.
    expect(attachment.mediaType).toBe('text/csv');
    expect(attachment.sizeBytes).toBe(csvExport.length);
    expect(attachment.sha256).toBe(createHash('sha256').update(csvExport).digest('hex'));

    const row = (await dataSource.query('SELECT stored_path FROM attachments WHERE id = ?', [attachment.id]))[0] as { stored_path: string };
    expect(row.stored_path).toBe(`attachments/${attachment.sha256.slice(0, 2)}/${attachment.sha256}`);
    expect(readFileSync(join(dataDir, row.stored_path)).equals(csvExport)).toBe(true);

    const audit = await dataSource.query(`SELECT action, after FROM audit_events WHERE entity_type = 'attachment' AND entity_id = ?`, [attachment.id]);
    expect(audit).toHaveLength(1);
    expect(JSON.parse(audit[0].after).sha256).toBe(attachment.sha256);

    const list = await session.agent.get(`/api/assays/${assayId}/attachments`).expect(200);
    expect(list.body.attachments.map((item: { id: number }) => item.id)).toEqual([attachment.id]);

    const content = await session.agent.get(attachment.contentUrl).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(content.headers['content-type']).toMatch(/^text\/csv/);
    expect(content.headers['content-disposition']).toMatch(/^attachment;/);
    expect((content.body as Buffer).equals(csvExport)).toBe(true);
  });

  it('hashes the content with SHA-256 as the standard defines it', async () => {
    const session = await signedIn(app, demoEmail('lead'));
    const response = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.from('abc', 'ascii'), 'abc.txt')
      .expect(201);
    expect(response.body.attachments[0].sha256).toBe(SHA256_OF_ABC);
  });

  it('accepts an Excel workbook whose content is a ZIP container', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const response = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', xlsxLike, 'reader-export.xlsx')
      .expect(201);
    expect(response.body.attachments[0].mediaType).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
  });

  it('refuses the whole upload with a field message when one file is of a refused type, and stores nothing', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const before = await counts();
    const response = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.from('Well,A405\nB1,0.2\n'), 'good.csv')
      .attach('files', Buffer.from('MZ\u0090\u0000'), 'reader.exe')
      .expect(400);
    expect(response.body.error.code).toBe('validation_error');
    expect(response.body.error.fields['files.1']).toMatch(/type \.exe is not accepted/);
    expect(await counts()).toEqual(before);
  });

  it('refuses a file whose content does not match its extension', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const before = await counts();
    const renamed = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.from('Well,A405\n'), 'not-really.xlsx')
      .expect(400);
    expect(renamed.body.error.fields['files.0']).toMatch(/not an Excel workbook/);
    const binary = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.from([0x41, 0x00, 0x42, 0x00, 0x43]), 'binary.csv')
      .expect(400);
    expect(binary.body.error.fields['files.0']).toMatch(/not a text file/);
    const empty = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.alloc(0), 'empty.csv')
      .expect(400);
    expect(empty.body.error.fields['files.0']).toMatch(/is empty/);
    expect(await counts()).toEqual(before);
  });

  it('accepts UTF-16 text, whose NUL bytes a byte-order mark explains', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Well\tA405\r\nC1\t0.3\r\n', 'utf16le')]);
    await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', utf16, 'utf16-export.txt')
      .expect(201);
  });

  it('answers 413 with a field message for a file over the size limit, and stores nothing', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const before = await counts();
    const response = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', Buffer.alloc(maxAttachmentBytes + 1, 0x41), 'huge.csv')
      .expect(413);
    expect(response.body.error.fields.files).toMatch(/at most 10 MB/);
    expect(await counts()).toEqual(before);
  });

  it('refuses more than five files and a body that is not multipart', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const before = await counts();
    let request = session.agent.post(`/api/assays/${assayId}/attachments`).set('X-CSRF-Token', session.csrfToken);
    for (let index = 0; index < 6; index += 1) request = request.attach('files', Buffer.from(`file ${index}\n`), `part-${index}.txt`);
    const tooMany = await request.expect(400);
    expect(tooMany.body.error.fields.files).toMatch(/at most 5 files/);
    const json = await session.agent.post(`/api/assays/${assayId}/attachments`).set('X-CSRF-Token', session.csrfToken).send({ files: [] }).expect(400);
    expect(json.body.error.fields.files).toMatch(/multipart\/form-data/);
    const none = await session.agent.post(`/api/assays/${assayId}/attachments`).set('X-CSRF-Token', session.csrfToken).field('note', 'x').expect(400);
    expect(none.body.error.fields.files).toMatch(/at least one file/);
    expect(await counts()).toEqual(before);
  });

  it('refuses the same content twice on one assay with 409, but stores it once for two assays', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const content = Buffer.from('Well,A405\nD4,0.444\n');
    await session.agent.post(`/api/assays/${assayId}/attachments`).set('X-CSRF-Token', session.csrfToken).attach('files', content, 'first.csv').expect(201);
    const before = await counts();
    const duplicate = await session.agent
      .post(`/api/assays/${assayId}/attachments`)
      .set('X-CSRF-Token', session.csrfToken)
      .attach('files', content, 'renamed copy.csv')
      .expect(409);
    expect(duplicate.body.error.code).toBe('duplicate_attachment');
    expect(duplicate.body.error.message).toMatch(/same content as first\.csv/);
    expect(await counts()).toEqual(before);

    await session.agent.post(`/api/assays/${otherAssayId}/attachments`).set('X-CSRF-Token', session.csrfToken).attach('files', content, 'first.csv').expect(201);
    const after = await counts();
    expect(after.rows).toBe(before.rows + 1);
    expect(after.files).toBe(before.files);
  });

  it('answers 404 for an unknown assay and 400 for a bad id, writing no file', async () => {
    const session = await signedIn(app, demoEmail('kineticist'));
    const before = await counts();
    await session.agent.post('/api/assays/999999/attachments').set('X-CSRF-Token', session.csrfToken).attach('files', Buffer.from('new content\n'), 'lost.csv').expect(404);
    await session.agent.post('/api/assays/abc/attachments').set('X-CSRF-Token', session.csrfToken).attach('files', Buffer.from('more new content\n'), 'lost.csv').expect(400);
    expect(await counts()).toEqual(before);
  });

  it('returns 403 for a viewer and a biologist, 401 when signed out', async () => {
    for (const role of ['viewer', 'biologist']) {
      const session = await signedIn(app, demoEmail(role));
      await session.agent.post(`/api/assays/${assayId}/attachments`).set('X-CSRF-Token', session.csrfToken).attach('files', csvExport, 'x.csv').expect(403);
    }
    const viewer = await signedIn(app, demoEmail('viewer'));
    await viewer.agent.get(`/api/assays/${assayId}/attachments`).expect(200);
    await request(app).get(`/api/assays/${assayId}/attachments`).expect(401);
    await request(app).get('/api/attachments/1/content').expect(401);
  });
});

describe('GET /api/attachments/:id/content', () => {
  it('answers 404 for an unknown attachment and 400 for a bad id', async () => {
    const session = await signedIn(app, demoEmail('viewer'));
    await session.agent.get('/api/attachments/424242/content').expect(404);
    await session.agent.get('/api/attachments/x/content').expect(400);
  });
});
