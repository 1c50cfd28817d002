import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { crc32, deflateRawSync } from 'node:zlib';
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { settleImports } from '@server/modules/imports/imports.service';
import { readZipCentralDirectory, verifyInflatedSizes } from '@server/modules/imports/zip-central-directory';
import { maxImportBytes, maxImportRows, type ImportJobDto } from '@shared/schemas/import';
import { binary, committed, csv, imported, previewed, readWorkbook, settled, upload, uploaded, workbook, type Cell } from './import-fixtures';
import { campaignBody, enzymeBody } from './registry-fixtures';
import { signInEveryRole, type Session } from './role-sessions';
import { createTestApp, removeDataDir, type TestApp } from './test-app';

let testApp: TestApp;
let as: Awaited<ReturnType<typeof signInEveryRole>>['as'];
let sessions: Awaited<ReturnType<typeof signInEveryRole>>['sessions'];
let lead: Session;
let kineticist: Session;
let enzymeId: number;
let leadId: number;

// The parent is registry-fixtures' invented 300-residue sequence: Cys45, Ser112, Trp150, His190, Asp230 and a
// repeating filler (position 12 is Ala, 20 Arg, 33 Ser, 34 Thr, 60 Arg).
async function newCampaign(): Promise<{ id: number; name: string; parentVariantId: number }> {
  return (await as('lead').post('/api/campaigns', campaignBody(enzymeId)).expect(201)).body;
}

async function register(campaignId: number, mutations: string): Promise<{ id: number; label: string; version: number }> {
  return (await as('biologist').post('/api/variants', { campaignId, mutations }).expect(201)).body;
}

async function count(sql: string, parameters: unknown[] = []): Promise<number> {
  const [{ n }] = await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM (${sql})`, parameters);
  return Number(n);
}

beforeAll(async () => {
  testApp = await createTestApp();
  ({ as, sessions } = await signInEveryRole(testApp.app));
  lead = sessions.lead;
  kineticist = sessions.kineticist;
  enzymeId = (await as('biologist').post('/api/enzymes', enzymeBody()).expect(201)).body.id;
  [{ id: leadId }] = await testApp.dataSource.query(`SELECT id FROM users WHERE email = 'lead@kcatalog.example'`);
});

afterAll(async () => {
  await settleImports(testApp.dataSource);
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

/** A ZIP archive written by hand (PKWARE APPNOTE 6.3.10 §4.3.7, §4.3.12, §4.3.16), to build hostile ones. */
function zip(entries: { name: string; data: Buffer; declaredSize?: number; stored?: boolean }[], options: { shareData?: boolean } = {}): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  let firstOffset = 0;
  entries.forEach((entry, index) => {
    const compressed = entry.stored ? entry.data : deflateRawSync(entry.data);
    const name = Buffer.from(entry.name, 'utf8');
    const size = entry.declaredSize ?? entry.data.length;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(entry.stored ? 0 : 8, 8);
    local.writeUInt32LE(crc32(entry.data), 14);
    local.writeUInt32LE(compressed.length, 18);
    local.writeUInt32LE(size, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(entry.stored ? 0 : 8, 10);
    central.writeUInt32LE(crc32(entry.data), 16);
    central.writeUInt32LE(compressed.length, 20);
    central.writeUInt32LE(size, 24);
    central.writeUInt16LE(name.length, 28);
    // Overlapping entries all point at the first entry's data, as the densest zip bombs do.
    central.writeUInt32LE(options.shareData && index > 0 ? firstOffset : offset, 42);
    centrals.push(central, name);
    if (options.shareData && index > 0) return;
    if (index === 0) firstOffset = offset;
    locals.push(local, name, compressed);
    offset += local.length + name.length + compressed.length;
  });
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

const workbookParts = [
  { name: '[Content_Types].xml', data: Buffer.from('<Types><Override ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/></Types>') },
  { name: 'xl/workbook.xml', data: Buffer.from('<workbook/>') },
];

function expectRefusal(
  response: { status: number; body: { error: { code: string; fields?: Record<string, string> } } },
  pattern: RegExp,
  field = 'file',
  status: 400 | 413 = 400,
) {
  expect(response.status, JSON.stringify(response.body)).toBe(status);
  expect(response.body.error.code).toBe(status === 413 ? 'payload_too_large' : 'validation_error');
  expect(response.body.error.fields?.[field]).toMatch(pattern);
}

describe('POST /api/imports', () => {
  it('takes an .xlsx workbook, lists its sheets with header rows and row counts, and keeps the file as an attachment', async () => {
    const content = await workbook({ Variants: [['Campaign', 'Mutations'], ['c', 'S112A'], ['c', 'H190N']], Notes: [['Anything'], ['x']] });
    const job = await uploaded(lead, 'variants', 'round 3.xlsx', content);
    expect(job.status).toBe('uploaded');
    expect(job.format).toBe('xlsx');
    expect(job.sheets.map((sheet) => [sheet.name, sheet.headers, sheet.rowCount])).toEqual([
      ['Variants', ['Campaign', 'Mutations'], 2],
      ['Notes', ['Anything'], 1],
    ]);
    const [attachment] = await testApp.dataSource.query(`SELECT * FROM attachments WHERE owner_type = 'import' AND owner_id = ?`, [job.id]);
    expect(attachment.original_name).toBe('round 3.xlsx');
    expect(attachment.size_bytes).toBe(content.length);
    expect(attachment.sha256).toBe(createHash('sha256').update(content).digest('hex'));
    expect(attachment.stored_path.startsWith('attachments/')).toBe(true);
    expect(readFileSync(join(testApp.dataDir, attachment.stored_path)).equals(content)).toBe(true);
    const file = await lead.agent.get(job.fileUrl).buffer(true).parse(binary).expect(200);
    expect((file.body as Buffer).equals(content)).toBe(true);
  });

  it('reads a workbook whose workbook part comes after its worksheets, with the shared strings before them', async () => {
    // A part order the ZIP format allows (the central directory says where each part is) and that
    // exceljs's streaming reader failed on, reading the worksheet before it knew the workbook.
    const content = await workbook({ Variants: [['Campaign', 'Mutations'], ['c', 'S112A'], ['c', 'H190N']], Notes: [['Anything'], ['x']] });
    const entries = readZipCentralDirectory(content, 1e9);
    const parts = await verifyInflatedSizes(content, entries, entries.map((entry) => entry.name));
    const rank = (name: string) =>
      ['[Content_Types].xml', '_rels/.rels', 'xl/_rels/workbook.xml.rels', 'xl/sharedStrings.xml', 'xl/styles.xml'].indexOf(name) + 1 ||
      (name.startsWith('xl/worksheets/') ? 10 : name === 'xl/workbook.xml' ? 30 : 20);
    const names = [...parts.keys()].filter((name) => !name.endsWith('/')).sort((first, second) => rank(first) - rank(second));
    expect(names.at(-1)).toBe('xl/workbook.xml');
    const reordered = zip(names.map((name) => ({ name, data: parts.get(name)! })));
    const job = await uploaded(lead, 'variants', 'reordered.xlsx', reordered);
    expect(job.sheets.map((sheet) => [sheet.name, sheet.rowCount])).toEqual([
      ['Variants', 2],
      ['Notes', 1],
    ]);
  });

  it('takes a .csv file (UTF-8, with or without a byte-order mark) as one sheet named after the file', async () => {
    const content = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), csv([['Campaign', 'Mutations'], ['c', 'Ser112Ala'], [null, null], ['c', 'W150F']])]);
    const job = await uploaded(lead, 'variants', 'round 3.csv', content);
    expect(job.format).toBe('csv');
    expect(job.sheets).toHaveLength(1);
    expect(job.sheets[0]).toMatchObject({ name: 'round 3', headers: ['Campaign', 'Mutations'], rowCount: 2 });
  });

  it.each([
    ['a CSV file named .xlsx', 'data.xlsx', () => csv([['Campaign'], ['x']]), /named \.xlsx but is not an Excel workbook/],
    ['a workbook named .csv', 'data.csv', () => workbook({ Sheet1: [['Campaign'], ['x']] }), /named \.csv but holds a workbook/],
    ['a legacy .xls (OLE2) file named .xlsx', 'data.xlsx', () => Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), Buffer.alloc(512)]), /legacy \.xls workbook/],
    ['a ZIP archive that is no workbook', 'data.xlsx', () => zip([{ name: 'readme.txt', data: Buffer.from('hello') }]), /not an Excel workbook/],
    ['a .txt file', 'data.txt', () => Buffer.from('Campaign\nx\n'), /only \.xlsx workbooks and \.csv files/],
    ['UTF-16 text named .csv', 'data.csv', () => Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Campaign\n', 'utf16le')]), /UTF-16/],
    ['binary data named .csv', 'data.csv', () => Buffer.from([0x43, 0x00, 0x41, 0x0a]), /NUL bytes/],
    ['Latin-1 text named .csv', 'data.csv', () => Buffer.from([0x4b, 0x6d, 0x20, 0xb5, 0x4d, 0x0a]), /not UTF-8/],
    ['an empty file', 'data.csv', () => Buffer.alloc(0), /empty/],
  ])('refuses %s, by its content', async (_label, name, content, pattern) => {
    const before = await count(`SELECT id FROM import_jobs`);
    expectRefusal(await upload(lead, 'variants', name, await content()), pattern);
    expect(await count(`SELECT id FROM import_jobs`)).toBe(before);
  });

  it('refuses a file over 20 MB', async () => {
    const response = await upload(lead, 'variants', 'big.csv', Buffer.alloc(maxImportBytes + 1, 'a'));
    expectRefusal(response, /larger than 20 MB/, 'file', 413);
  });

  it('refuses a zip bomb: parts that declare more than the cap unpacked', async () => {
    // 100 MB of zeros deflates to about 100 kB; three such sheets declare 300 MB.
    const zeros = Buffer.alloc(100 * 1024 * 1024);
    const sheets = [1, 2, 3].map((index) => ({ name: `xl/worksheets/sheet${index}.xml`, data: zeros }));
    const bomb = zip([...workbookParts, ...sheets]);
    expect(bomb.length).toBeLessThan(1024 * 1024);
    expectRefusal(await upload(lead, 'variants', 'bomb.xlsx', bomb), /unpacks to more than 256 MB/);
  });

  it('refuses a zip bomb: overlapping parts that repeat one compressed block', async () => {
    const block = { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(1024 * 1024) };
    const overlapping = zip([block, { ...block, name: 'xl/worksheets/sheet2.xml' }, { ...block, name: 'xl/worksheets/sheet3.xml' }], { shareData: true });
    expectRefusal(await upload(lead, 'variants', 'overlap.xlsx', overlapping), /share their data/);
  });

  it('refuses a part that inflates to more than its directory entry declares', async () => {
    const lying = zip([...workbookParts, { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(10 * 1024 * 1024), declaredSize: 1000 }]);
    expectRefusal(await upload(lead, 'variants', 'lying.xlsx', lying), /unpacks to more than the 1000 bytes/);
  });

  it('refuses a sheet with more than 200,000 data rows', async () => {
    const lines = ['Campaign', ...Array.from({ length: maxImportRows + 1 }, () => 'c')].join('\n');
    expectRefusal(await upload(lead, 'variants', 'long.csv', Buffer.from(lines)), /more than 200,000 data rows/);
    const fine = ['Campaign', ...Array.from({ length: maxImportRows }, () => 'c')].join('\n');
    const job = await uploaded(lead, 'variants', 'long-enough.csv', Buffer.from(fine));
    expect(job.sheets[0].rowCount).toBe(maxImportRows);
  });

  it('refuses an unknown kind and a request without a file', async () => {
    expectRefusal(await upload(lead, 'enzymes', 'x.csv', csv([['a'], ['b']])), /must be one of variants, measurements, rate-points, ph-series/, 'kind');
    const response = await lead.agent.post('/api/imports').set('X-CSRF-Token', lead.csrfToken).field('kind', 'variants');
    expectRefusal(response, /choose a file/);
  });

  it('returns 403 for a viewer and 401 when signed out, and stores nothing', async () => {
    const before = await count(`SELECT id FROM import_jobs`);
    const response = await upload(sessions.viewer, 'variants', 'v.csv', csv([['Campaign', 'Mutations'], ['c', 'S112A']]));
    expect(response.status).toBe(403);
    const anonymous = await (await import('supertest')).default(testApp.app).post('/api/imports').field('kind', 'variants').attach('file', Buffer.from('a\nb'), 'v.csv');
    expect([401, 403]).toContain(anonymous.status);
    expect(await count(`SELECT id FROM import_jobs`)).toBe(before);
    // A viewer reads the history and jobs (they are registry data), but cannot preview or commit one.
    const job = await uploaded(lead, 'variants', 'v.csv', csv([['Campaign', 'Mutations'], ['c', 'S112A']]));
    await sessions.viewer.agent.get(`/api/imports/${job.id}`).expect(200);
    const preview = await sessions.viewer.agent
      .post(`/api/imports/${job.id}/preview`)
      .set('X-CSRF-Token', sessions.viewer.csrfToken)
      .send({ version: job.version, sheet: job.sheets[0].name, columns: job.sheets[0].suggested.columns });
    expect(preview.status).toBe(403);
  });
});

describe('column mapping', () => {
  it('is detected from header names and the units written in them', async () => {
    const headers = ['Variant', 'Campaign', 'Substrate', 'Temperature (K)', 'pH', 'Assay date', 'kcat [1/s]', 'SE', 'Km (mM)', 'Km SE (mM)', 'kcat/Km (M-1 s-1)', 'kcat/Km, SE', 'Buffer', 'Buffer (mM)', 'Comments'];
    const job = await uploaded(kineticist, 'measurements', 'detect.csv', csv([headers, headers.map(() => 'x')]));
    const { columns, source } = job.sheets[0].suggested;
    expect(columns).toEqual({
      variant: { column: 0 },
      campaign: { column: 1 },
      substrate: { column: 2 },
      temperature: { column: 3, unit: 'K' },
      ph: { column: 4 },
      assayDate: { column: 5 },
      kcat: { column: 6, unit: '1/s' },
      kcatSe: { column: 7, unit: '1/s' },
      km: { column: 8, unit: 'mM' },
      kmSe: { column: 9, unit: 'mM' },
      kcatOverKm: { column: 10, unit: 'M⁻¹ s⁻¹' },
      kcatOverKmSe: { column: 11, unit: 'M⁻¹ s⁻¹' },
      bufferName: { column: 12 },
      bufferConcentration: { column: 13, unit: 'mM' },
      notes: { column: 14 },
    });
    expect(new Set(Object.values(source))).toEqual(new Set(['detected']));
  });

  it('is remembered per user and kind, and offered for the next file with those headers', async () => {
    const campaign = await newCampaign();
    const headers = ['Campaign', 'Variant', 'Substrate', 'T (°C)', 'pH', 'Day', 'Turnover (1/min)', 'Turnover error (1/min)', 'Km (mM)', 'Km SE (mM)'];
    const rows: Cell[][] = [headers, [campaign.name, 'parent', 'anilide', 37, 6, '2026-03-04', 600, 30, 1, 0.1]];
    const first = await uploaded(kineticist, 'measurements', 'first.csv', csv(rows));
    expect(first.sheets[0].suggested.columns.kcat).toBeUndefined();
    const columns = { ...first.sheets[0].suggested.columns, assayDate: { column: 5 }, kcat: { column: 6 }, kcatSe: { column: 7 } };
    const checked = await previewed(kineticist, first, { columns });
    expect(checked.status).toBe('previewed');
    expect(checked.counts).toEqual({ new: 1, updated: 0, unchanged: 0, invalid: 0 });

    const second = await uploaded(kineticist, 'measurements', 'second.csv', csv(rows));
    expect(second.sheets[0].suggested.columns).toMatchObject({ assayDate: { column: 5 }, kcat: { column: 6, unit: '1/min' }, kcatSe: { column: 7, unit: '1/min' } });
    expect(second.sheets[0].suggested.source.kcat).toBe('saved');
    // Another user's saved mapping is theirs alone.
    const byLead = await uploaded(lead, 'measurements', 'third.csv', csv(rows));
    expect(byLead.sheets[0].suggested.columns.kcat).toBeUndefined();
  });

  it('refuses a mapping that misses a required field, names a unit it cannot convert, or mixes units of a value and its SE', async () => {
    const headers = ['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Assay date', 'kcat (1/s)', 'kcat SE (1/min)', 'Km (mg/mL)', 'Km SE'];
    const job = await uploaded(kineticist, 'measurements', 'bad-mapping.csv', csv([headers, headers.map(() => '1')]));
    const { columns } = job.sheets[0].suggested;
    const response = await kineticist.agent
      .post(`/api/imports/${job.id}/preview`)
      .set('X-CSRF-Token', kineticist.csrfToken)
      .send({ version: job.version, sheet: job.sheets[0].name, columns: { ...columns, substrate: null, extra: { column: 1 } } });
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toMatchObject({
      'columns.substrate': 'is required: choose the column that holds Substrate',
      'columns.extra': 'is not a field of a measurements (fitted values) import',
      'columns.km': expect.stringMatching(/the header's unit mg\/mL is not one Kcatalog converts/),
      'columns.kcatSe': 'mixed units: kcat is in 1/s but its SE in 1/min; give both in one unit',
    });
    const [stored] = await testApp.dataSource.query(`SELECT status, version FROM import_jobs WHERE id = ?`, [job.id]);
    expect(stored).toEqual({ status: 'uploaded', version: job.version });
  });
});

describe('variants', () => {
  it('imports from .xlsx: any mutation notation, statuses, construct ids, notes and lineage, with an audit event each', async () => {
    const campaign = await newCampaign();
    const rows: Cell[][] = [
      ['Campaign', 'Mutations', 'Status', 'Construct id', 'Notes', 'Lineage parent'],
      [campaign.name, 'S112A', 'cloned', 'pKC-001', 'nucleophile knock-out', null],
      [campaign.name, 'p.[Ser112Ala;His190Asn]', 'designed', 'pKC-002', null, 'S112A'],
      [campaign.name, 'w150f', 'sequence verified', null, '=HYPERLINK("x")', null],
    ];
    const job = await imported(lead, 'variants', 'variants.xlsx', await workbook({ Variants: rows }));
    expect(job.status).toBe('committed');
    expect(job.counts).toEqual({ new: 3, updated: 0, unchanged: 0, invalid: 0 });
    const stored = await testApp.dataSource.query(
      `SELECT v.label, v.hgvs, v.status, v.construct_id, v.notes, p.label AS parent, v.version, v.created_by_id
         FROM variants v LEFT JOIN variants p ON p.id = v.parent_variant_id WHERE v.campaign_id = ? AND v.mutation_count > 0 ORDER BY v.label`,
      [campaign.id],
    );
    expect(stored).toEqual([
      { label: 'S112A', hgvs: 'p.Ser112Ala', status: 'cloned', construct_id: 'pKC-001', notes: 'nucleophile knock-out', parent: null, version: 1, created_by_id: leadId },
      { label: 'S112A/H190N', hgvs: 'p.[Ser112Ala;His190Asn]', status: 'designed', construct_id: 'pKC-002', notes: null, parent: 'S112A', version: 1, created_by_id: leadId },
      { label: 'W150F', hgvs: 'p.Trp150Phe', status: 'sequence-verified', construct_id: null, notes: '=HYPERLINK("x")', parent: null, version: 1, created_by_id: leadId },
    ]);
    expect(await count(`SELECT id FROM audit_events WHERE entity_type = 'variant' AND action = 'create' AND campaign_id = ?`, [campaign.id])).toBe(4);
    expect(await count(`SELECT m.id FROM mutations m JOIN variants v ON v.id = m.variant_id WHERE v.campaign_id = ?`, [campaign.id])).toBe(4);
    expect(await count(`SELECT id FROM audit_events WHERE entity_type = 'import' AND entity_id = ? AND action = 'commit'`, [job.id])).toBe(1);
  });

  it('imports from .csv; importing the same file again changes nothing', async () => {
    const campaign = await newCampaign();
    const rows: Cell[][] = [['Campaign', 'Mutations', 'Status'], [campaign.name, 'H190N', 'cloned'], [campaign.name, 'parent', 'purified']];
    const first = await imported(lead, 'variants', 'v.csv', csv(rows));
    expect(first.counts).toEqual({ new: 1, updated: 0, unchanged: 1, invalid: 0 });
    const events = await count(`SELECT id FROM audit_events WHERE campaign_id = ?`, [campaign.id]);
    const again = await imported(lead, 'variants', 'v.csv', csv(rows));
    expect(again.counts).toEqual({ new: 0, updated: 0, unchanged: 2, invalid: 0 });
    expect(await count(`SELECT id FROM audit_events WHERE campaign_id = ?`, [campaign.id])).toBe(events);
    expect(await count(`SELECT id FROM variants WHERE campaign_id = ? AND version > 1`, [campaign.id])).toBe(0);
  });

  it('updates the mapped fields of a registered variant through its version, with an audit event, and leaves unmapped ones', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'W150F');
    await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version, notes: 'keep me', constructId: 'pKC-9' }).expect(200);
    const job = await imported(lead, 'variants', 'status.csv', csv([['Campaign', 'Variant', 'Status'], [campaign.name, 'Trp150Phe', 'purified']]));
    expect(job.counts).toEqual({ new: 0, updated: 1, unchanged: 0, invalid: 0 });
    const [row] = await testApp.dataSource.query(`SELECT status, notes, construct_id, version FROM variants WHERE id = ?`, [variant.id]);
    expect(row).toEqual({ status: 'purified', notes: 'keep me', construct_id: 'pKC-9', version: 3 });
    const [event] = await testApp.dataSource.query(`SELECT action, before, after FROM audit_events WHERE entity_type = 'variant' AND entity_id = ? ORDER BY id DESC LIMIT 1`, [variant.id]);
    expect(event.action).toBe('status');
    expect(JSON.parse(event.before)).toMatchObject({ status: 'designed', version: 2 });
    expect(JSON.parse(event.after)).toMatchObject({ status: 'purified', version: 3 });
  });

  it('lists each bad row with its row number, column and reason: wrong residue, bad notation, repeated set, unknown lineage parent, unknown campaign', async () => {
    const campaign = await newCampaign();
    const rows: Cell[][] = [
      ['Campaign', 'Mutations', 'Status', 'Lineage parent'],
      [campaign.name, 'C112A', null, null],
      [campaign.name, 'S112', null, null],
      [campaign.name, 'T34A', 'shipped', null],
      [campaign.name, 'T34A', null, null],
      [campaign.name, 'R60K', null, 'W150Y'],
      ['No such campaign', 'R60K', null, null],
      [campaign.name, 'R60K', null, null],
    ];
    const job = await uploaded(lead, 'variants', 'bad.csv', csv(rows));
    const checked = await previewed(lead, job);
    expect(checked.counts).toEqual({ new: 2, updated: 0, unchanged: 0, invalid: 5 });
    expect(checked.problems).toEqual([
      { row: 2, column: 'Mutations', field: 'mutations', message: 'C112A: position 112 of the parent is Ser, not Cys' },
      { row: 3, column: 'Mutations', field: 'mutations', message: 'S112: not a substitution (e.g. C112A, Cys112Ala or p.Cys112Ala)' },
      { row: 4, column: 'Status', field: 'status', message: expect.stringMatching(/^must be one of designed, cloned, .*; got 'shipped'$/) },
      { row: 6, column: 'Lineage parent', field: 'parentVariant', message: `W150Y is not registered in campaign ${campaign.name}, nor on an earlier row` },
      { row: 7, column: 'Campaign', field: 'campaign', message: 'no campaign is named No such campaign' },
    ]);
    // Row 5 (T34A once row 4 was refused) and row 8 are fine and shown as they will be stored; a preview writes nothing.
    expect(checked.preview.rows.map((row) => [row.row, row.outcome, row.values.Label])).toEqual([
      [5, 'new', 'T34A'],
      [8, 'new', 'R60K'],
    ]);
    expect(await count(`SELECT id FROM variants WHERE campaign_id = ?`, [campaign.id])).toBe(1);
  });
});

const measurementHeaders = ['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Buffer', 'Buffer concentration (mM)', 'Assay date', 'kcat (1/min)', 'kcat SE (1/min)', 'Km (µM)', 'Km SE (µM)', 'Replicates'];

describe('measurements with fitted values', () => {
  it('imports from .xlsx, converting to SI units as POST /api/measurements does', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'S112A');
    const rows: Cell[][] = [measurementHeaders, [campaign.name, 'S112A', 'anilide', 37, 5.5, 'MES', 50, new Date(Date.UTC(2026, 2, 4)), 600, 30, 250, 20, 3]];
    const job = await imported(kineticist, 'measurements', 'm.xlsx', await workbook({ Kinetics: rows }));
    expect(job.counts).toEqual({ new: 1, updated: 0, unchanged: 0, invalid: 0 });
    const [measurement] = await testApp.dataSource.query(
      `SELECT m.source, m.model, m.kcat, m.kcat_se, m.km, m.km_se, m.kcat_over_km, m.review_state, a.temperature_k, a.buffer_molar, a.assay_date, a.replicate_count
         FROM measurements m JOIN assays a ON a.id = m.assay_id WHERE m.variant_id = ?`,
      [variant.id],
    );
    // 600 min⁻¹ = 10 s⁻¹, 250 µM = 2.5 × 10⁻⁴ M, 37 °C = 310.15 K (SI Brochure, 9th ed., 2019: minute, prefixes, kelvin).
    expect(measurement).toMatchObject({ source: 'entered', model: 'michaelis-menten', kcat: 10, kcat_se: 0.5, review_state: 'draft', assay_date: '2026-03-04', replicate_count: 3 });
    expect(measurement.km).toBeCloseTo(2.5e-4, 15);
    expect(measurement.km_se).toBeCloseTo(2e-5, 15);
    expect(measurement.kcat_over_km).toBeCloseTo(10 / 2.5e-4, 6);
    expect(measurement.temperature_k).toBeCloseTo(310.15, 12);
    expect(measurement.buffer_molar).toBeCloseTo(0.05, 15);
    const [summary] = await testApp.dataSource.query(`SELECT summary_measurement_count FROM variants WHERE id = ?`, [variant.id]);
    expect(summary.summary_measurement_count).toBe(1);
  });

  it('imports from .csv; the same file again changes nothing; a changed value supersedes the stored measurement', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'H190N');
    const row = (kcat: number): Cell[] => [campaign.name, 'H190N', 'anilide', 37, 5.5, 'MES', 50, '2026-03-05', kcat, 30, 250, 20, 3];
    const first = await imported(kineticist, 'measurements', 'm.csv', csv([measurementHeaders, row(600), row(660)]));
    expect(first.counts).toEqual({ new: 2, updated: 0, unchanged: 0, invalid: 0 });
    const again = await imported(kineticist, 'measurements', 'm.csv', csv([measurementHeaders, row(600), row(660)]));
    expect(again.counts).toEqual({ new: 0, updated: 0, unchanged: 2, invalid: 0 });
    expect(await count(`SELECT id FROM measurements WHERE variant_id = ?`, [variant.id])).toBe(2);

    const changed = await imported(kineticist, 'measurements', 'm2.csv', csv([measurementHeaders, row(600), row(720)]));
    expect(changed.counts).toEqual({ new: 0, updated: 1, unchanged: 1, invalid: 0 });
    const measurements = await testApp.dataSource.query(`SELECT id, kcat, superseded_by_id, version FROM measurements WHERE variant_id = ? ORDER BY id`, [variant.id]);
    expect(measurements).toHaveLength(3);
    expect(measurements[1]).toMatchObject({ kcat: 11, superseded_by_id: measurements[2].id, version: 2 });
    expect(measurements[2]).toMatchObject({ kcat: 12, superseded_by_id: null });
    const actions = await testApp.dataSource.query(`SELECT entity_id, action FROM audit_events WHERE entity_id IN (?, ?) AND entity_type = 'measurement' ORDER BY id`, [measurements[1].id, measurements[2].id]);
    expect(actions).toEqual([
      { entity_id: measurements[1].id, action: 'create' },
      { entity_id: measurements[2].id, action: 'create' },
      { entity_id: measurements[1].id, action: 'supersede' },
    ]);
  });

  it('refuses, row by row, an unknown variant, a wrong residue, a non-numeric kcat, a negative Km and a cell in another unit', async () => {
    const campaign = await newCampaign();
    await register(campaign.id, 'S112A');
    const base: Cell[] = [campaign.name, 'S112A', 'anilide', 37, 5.5, 'MES', 50, '2026-03-06', 600, 30, 250, 20, 3];
    const rows: Cell[][] = [
      measurementHeaders,
      base,
      [campaign.name, 'H190Q', ...base.slice(2)],
      [campaign.name, 'C112A', ...base.slice(2)],
      [...base.slice(0, 8), 'fast', ...base.slice(9)],
      [...base.slice(0, 10), -250, ...base.slice(11)],
      [...base.slice(0, 10), '0.25 mM', ...base.slice(11)],
      [...base.slice(0, 10), '250 µM', ...base.slice(11)],
    ];
    const job = await uploaded(kineticist, 'measurements', 'bad.csv', csv(rows));
    const checked = await previewed(kineticist, job);
    expect(checked.counts).toEqual({ new: 2, updated: 0, unchanged: 0, invalid: 5 });
    expect(checked.problems).toEqual([
      { row: 3, column: 'Variant', field: 'variant', message: `no variant H190Q is registered in campaign ${campaign.name}; import or register it first` },
      { row: 4, column: 'Variant', field: 'variant', message: 'C112A: position 112 of the parent is Ser, not Cys' },
      { row: 5, column: 'kcat (1/min)', field: 'kcat', message: "must be a number, got 'fast'" },
      { row: 6, column: 'Km (µM)', field: 'km', message: 'must be greater than 0' },
      { row: 7, column: 'Km (µM)', field: 'km', message: 'mixed units: this cell is in mM but the column is in µM; convert it or give it a column of its own' },
    ]);
  });
});

// Puromycin, treated cells (Treloar 1974, as tabulated in Bates & Watts, Nonlinear Regression Analysis and Its
// Applications, 1988, Appendix A1.3): substrate in ppm, rate in counts/min², read here as mM and µM/min.
const puromycinS = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const puromycinV = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const pointHeaders = ['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Assay date', 'Enzyme concentration (nM)', '[S] (mM)', 'v0 (µM/min)', 'Replicate'];

describe('raw rate points', () => {
  it('groups rows into assays and fits each on import (.xlsx): Puromycin gives Bates & Watts’ Vmax and Km', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'W150F');
    const rows: Cell[][] = [pointHeaders, ...puromycinS.map((s, index): Cell[] => [campaign.name, 'W150F', 'anilide', 37, 5.5, new Date(Date.UTC(2026, 2, 7)), 10, s, puromycinV[index], (index % 2) + 1])];
    const job = await imported(kineticist, 'rate-points', 'points.xlsx', await workbook({ Points: rows }));
    expect(job.counts).toEqual({ new: 12, updated: 0, unchanged: 0, invalid: 0 });
    const [measurement] = await testApp.dataSource.query(
      `SELECT m.source, m.vmax, m.km, m.kcat, m.point_count, a.replicate_count, a.s_unit, a.v_unit FROM measurements m JOIN assays a ON a.id = m.assay_id WHERE m.variant_id = ?`,
      [variant.id],
    );
    // Bates & Watts (1988), §2.2.1: Vmax = 212.7 and K = 0.06412 for the treated series. With 10 nM enzyme,
    // kcat = 212.68 µM/min ÷ 10 nM = 21,268 min⁻¹ = 354.5 s⁻¹.
    expect(measurement).toMatchObject({ source: 'fitted', point_count: 12, replicate_count: 2, s_unit: 'mM', v_unit: 'µM/min' });
    expect(measurement.vmax / (1e-6 / 60)).toBeCloseTo(212.68, 1);
    expect(measurement.km / 1e-3).toBeCloseTo(0.06412, 4);
    expect(measurement.kcat).toBeCloseTo(354.47, 1);
    expect(await count(`SELECT p.id FROM rate_points p JOIN assays a ON a.id = p.assay_id WHERE a.variant_id = ?`, [variant.id])).toBe(12);
  });

  it('imports from .csv; the same file again changes nothing, and other points for a stored assay are refused', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'R60K');
    const rows = (scale: number): Cell[][] => [pointHeaders, ...puromycinS.map((s, index): Cell[] => [campaign.name, 'R60K', 'anilide', 37, 5.5, '2026-03-08', 10, s, puromycinV[index] * scale, 1])];
    const first = await imported(kineticist, 'rate-points', 'points.csv', csv(rows(1)));
    expect(first.counts.new).toBe(12);
    const again = await imported(kineticist, 'rate-points', 'points.csv', csv(rows(1)));
    expect(again.counts).toEqual({ new: 0, updated: 0, unchanged: 12, invalid: 0 });
    const other = await previewed(kineticist, await uploaded(kineticist, 'rate-points', 'other.csv', csv(rows(2))));
    expect(other.counts.invalid).toBe(12);
    expect(other.problems[0].message).toMatch(/already holds other rate points, exclusions or model; an import does not overwrite raw data/);
    expect(await count(`SELECT id FROM assays WHERE variant_id = ?`, [variant.id])).toBe(1);
  });

  it('refuses an assay whose points cannot be fitted, on every one of its rows', async () => {
    const campaign = await newCampaign();
    await register(campaign.id, 'T34A');
    const rows: Cell[][] = [pointHeaders, ...[0.1, 0.2].map((s): Cell[] => [campaign.name, 'T34A', 'anilide', 37, 5.5, '2026-03-09', 10, s, 5, 1])];
    const checked = await previewed(kineticist, await uploaded(kineticist, 'rate-points', 'two.csv', csv(rows)));
    expect(checked.problems.map((problem) => problem.row)).toEqual([2, 3]);
    expect(checked.problems[0].message).toBe('must contain at least three included points with distinct substrate concentrations');
  });
});

describe('pH series', () => {
  // k = kmax / (1 + 10^(pKa1 − pH) + 10^(pH − pKa2)), the two-ionisation bell (e.g. Cornish-Bowden, Fundamentals of
  // Enzyme Kinetics, 4th ed., 2012, ch. 9); points generated from it with pKa1 5, pKa2 8 and kmax 10⁵ M⁻¹ s⁻¹.
  const bell = (ph: number) => 1e5 / (1 + 10 ** (5 - ph) + 10 ** (ph - 8));
  const phs = [4, 4.5, 5, 5.5, 6, 6.5, 7, 7.5, 8, 8.5, 9];

  it.each(['xlsx', 'csv'])('fits one profile per variant and series from .%s, and a re-import changes nothing', async (format) => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, format === 'xlsx' ? 'A12G' : 'A12V');
    const rows: Cell[][] = [['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'kcat/Km (M-1 s-1)'], ...phs.map((ph): Cell[] => [campaign.name, variant.label, 'anilide', 37, ph, bell(ph)])];
    const content = format === 'xlsx' ? await workbook({ 'pH series': rows }) : csv(rows);
    const job = await imported(kineticist, 'ph-series', `ph.${format}`, content);
    expect(job.counts).toEqual({ new: 11, updated: 0, unchanged: 0, invalid: 0 });
    const [profile] = await testApp.dataSource.query(`SELECT rate_kind, model, pka1, pka2, ph_optimum FROM ph_profiles WHERE variant_id = ?`, [variant.id]);
    expect(profile).toMatchObject({ rate_kind: 'kcatOverKm', model: 'bell' });
    expect(profile.pka1).toBeCloseTo(5, 6);
    expect(profile.pka2).toBeCloseTo(8, 6);
    expect(profile.ph_optimum).toBeCloseTo(6.5, 6);
    const [summary] = await testApp.dataSource.query(`SELECT summary_ph_optimum FROM variants WHERE id = ?`, [variant.id]);
    expect(summary.summary_ph_optimum).toBeCloseTo(6.5, 6);
    const again = await imported(kineticist, 'ph-series', `ph.${format}`, content);
    expect(again.counts).toEqual({ new: 0, updated: 0, unchanged: 11, invalid: 0 });
  });
});

describe('committing', () => {
  async function bigFile(campaignName: string, badRow: number): Promise<Buffer> {
    const rows: Cell[][] = [['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Assay date', 'kcat (1/s)', 'kcat SE (1/s)', 'Km (mM)', 'Km SE (mM)']];
    for (let index = 0; index < 10_000; index += 1) {
      const sheetRow = index + 2;
      rows.push([campaignName, 'parent', 'anilide', 37, 5.5, `2026-0${1 + (index % 9)}-1${index % 10}`, 10 + (index % 7), 0.5, sheetRow === badRow ? -1 : 1, 0.1]);
    }
    return workbook({ Measurements: rows });
  }

  it('all or nothing (the default): one bad row, row 9,999 of 10,000, rolls back every row', async () => {
    const campaign = await newCampaign();
    const job = await uploaded(kineticist, 'measurements', 'big.xlsx', await bigFile(campaign.name, 9999));
    const checked = await previewed(kineticist, job);
    expect(checked.counts).toEqual({ new: 9999, updated: 0, unchanged: 0, invalid: 1 });
    expect(checked.problems).toEqual([{ row: 9999, column: 'Km (mM)', field: 'km', message: 'must be greater than 0' }]);
    const result = await committed(kineticist, checked);
    expect(result.status).toBe('failed');
    expect(result.message).toMatch(/^Nothing was imported: 1 of 10,000 rows have problems/);
    expect(result.progress).toEqual({ processed: 10_000, total: 10_000 });
    expect(await count(`SELECT id FROM assays WHERE variant_id = ?`, [campaign.parentVariantId])).toBe(0);
    expect(await count(`SELECT id FROM audit_events WHERE campaign_id = ? AND entity_type IN ('assay', 'measurement')`, [campaign.id])).toBe(0);

    // Only the valid rows, on the same job: 9,999 written, the bad one returned with its reason.
    const partial = await committed(kineticist, result, 'valid-only');
    expect(partial.status).toBe('committed');
    expect(partial.counts).toEqual({ new: 9999, updated: 0, unchanged: 0, invalid: 1 });
    expect(await count(`SELECT id FROM measurements WHERE variant_id = ?`, [campaign.parentVariantId])).toBe(9999);
    // Written in batches: each row's assay holds that row's measurement, in row order, and both are audited.
    const written = await testApp.dataSource.query(
      `SELECT a.assay_date AS day, m.kcat FROM assays a JOIN measurements m ON m.assay_id = a.id WHERE a.variant_id = ? ORDER BY a.id, m.id`,
      [campaign.parentVariantId],
    );
    const rowsWritten = Array.from({ length: 10_000 }, (_, index) => ({ day: `2026-0${1 + (index % 9)}-1${index % 10}`, kcat: 10 + (index % 7) }));
    expect(written).toEqual(rowsWritten.filter((_, index) => index + 2 !== 9999));
    const audited = `SELECT e.id FROM audit_events e JOIN measurements m ON m.id = e.entity_id AND json_extract(e.after, '$.assayId') = m.assay_id
                      WHERE e.entity_type = 'measurement' AND e.action = 'create' AND m.variant_id = ?`;
    expect(await count(audited, [campaign.parentVariantId])).toBe(9999);
    expect(await count(`SELECT id FROM audit_events WHERE campaign_id = ? AND entity_type = 'assay' AND action = 'create'`, [campaign.id])).toBe(9999);
    expect(partial.rejectedUrl).toBe(`/api/imports/${job.id}/rejected.xlsx`);
    const rejected = await kineticist.agent.get(partial.rejectedUrl!).buffer(true).parse(binary).expect(200);
    const sheets = await readWorkbook(rejected.body as Buffer);
    expect(sheets['Rejected rows']).toEqual([
      ['Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Assay date', 'kcat (1/s)', 'kcat SE (1/s)', 'Km (mM)', 'Km SE (mM)', 'Row in original', 'Reason'],
      [campaign.name, 'parent', 'anilide', 37, 5.5, '2026-08-17', 11, 0.5, -1, 0.1, 9999, 'Km (mM): must be greater than 0'],
    ]);
  }, 180_000);

  it('refuses a commit with a stale version (409), of someone else’s job (403), and of a job already committed (409)', async () => {
    const campaign = await newCampaign();
    const job = await uploaded(kineticist, 'variants', 'v.csv', csv([['Campaign', 'Mutations'], [campaign.name, 'S33A']]));
    const checked = await previewed(kineticist, job);
    const stale = await kineticist.agent.post(`/api/imports/${job.id}/commit`).set('X-CSRF-Token', kineticist.csrfToken).send({ version: job.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    const other = await sessions.biologist.agent.post(`/api/imports/${job.id}/commit`).set('X-CSRF-Token', sessions.biologist.csrfToken).send({ version: checked.version });
    expect(other.status).toBe(403);
    const done = await committed(kineticist, checked);
    expect(done.status).toBe('committed');
    const twice = await kineticist.agent.post(`/api/imports/${job.id}/commit`).set('X-CSRF-Token', kineticist.csrfToken).send({ version: done.version });
    expect(twice.status).toBe(409);
    expect(await count(`SELECT id FROM variants WHERE campaign_id = ? AND label = 'S33A'`, [campaign.id])).toBe(1);
  });

  it('refuses a row whose stored record changed between the preview and the commit', async () => {
    const campaign = await newCampaign();
    const variant = await register(campaign.id, 'T34S');
    const job = await uploaded(lead, 'variants', 'status.csv', csv([['Campaign', 'Mutations', 'Status'], [campaign.name, 'T34S', 'cloned']]));
    const checked = await previewed(lead, job);
    expect(checked.counts.updated).toBe(1);
    await as('biologist').patch(`/api/variants/${variant.id}`, { version: variant.version, notes: 'edited meanwhile' }).expect(200);
    const result = await committed(lead, checked);
    expect(result.status).toBe('failed');
    expect(result.problems[0].message).toBe(`the stored variant ${variant.id} was changed by someone else since the preview (now at version 2); preview again`);
    const [row] = await testApp.dataSource.query(`SELECT status FROM variants WHERE id = ?`, [variant.id]);
    expect(row.status).toBe('designed');
  });

  it('keeps progress and counts on the job, in the history with who and when', async () => {
    const { body } = await lead.agent.get('/api/imports').expect(200);
    const rows = body.rows as ImportJobDto[];
    expect(rows.length).toBeGreaterThan(5);
    const latest = rows[0];
    expect(new Date(latest.createdAt).getTime()).toBeGreaterThanOrEqual(new Date(rows[rows.length - 1].createdAt).getTime());
    expect(latest).toHaveProperty('createdBy.name');
    expect(latest).toHaveProperty('progress');
    expect(latest).not.toHaveProperty('problems');
    const done = rows.find((row) => row.status === 'committed')!;
    expect(done.progress.processed).toBe(done.progress.total);
    expect(done.finishedAt).not.toBeNull();
  });
});

describe('templates', () => {
  it.each(['variants', 'measurements', 'rate-points', 'ph-series'] as const)('gives a %s template with units in the header, lists and instructions', async (kind) => {
    const response = await sessions.viewer.agent.get(`/api/imports/templates/${kind}.xlsx`).buffer(true).parse(binary).expect(200);
    expect(response.headers['content-disposition']).toContain(`kcatalog-${kind}-template.xlsx`);
    const sheets = await readWorkbook(response.body as Buffer);
    const [dataSheet, instructions, lists] = Object.keys(sheets);
    expect([instructions, lists]).toEqual(['Instructions', 'Lists']);
    const headers = sheets[dataSheet][0] as string[];
    expect(sheets.Instructions.length).toBeGreaterThan(headers.length);
    if (kind === 'measurements') {
      expect(headers).toEqual(expect.arrayContaining(['Temperature (°C)', 'kcat (1/s)', 'kcat SE (1/s)', 'Km (mM)', 'kcat/Km (M⁻¹ s⁻¹)', 'Enzyme concentration (nM)']));
      expect(sheets.Lists[0]).toEqual(['Method', 'Model']);
    }
    if (kind === 'variants') expect(sheets.Lists.map((row) => row[0])).toEqual(['Status', 'designed', 'cloned', 'sequence-verified', 'expressed', 'purified', 'characterized', 'failed', 'archived']);
    // Every header of the template is detected again when it is uploaded.
    const job = await uploaded(lead, kind, `template.xlsx`, response.body as Buffer);
    expect(Object.keys(job.sheets[0].suggested.columns)).toHaveLength(headers.length);
  });

  it('imports a filled template', async () => {
    const campaign = await newCampaign();
    const template = await sessions.viewer.agent.get('/api/imports/templates/variants.xlsx').buffer(true).parse(binary).expect(200);
    const sheets = await readWorkbook(template.body as Buffer);
    const headers = sheets.Variants[0] as string[];
    const values: Record<string, Cell> = { Campaign: campaign.name, Mutations: 'D230N', Status: 'cloned' };
    const filled = await workbook({ Variants: [headers, headers.map((header) => values[header] ?? null)] });
    const job = await imported(lead, 'variants', 'filled.xlsx', filled);
    expect(job.counts.new).toBe(1);
    expect(await count(`SELECT id FROM variants WHERE campaign_id = ? AND label = 'D230N' AND status = 'cloned'`, [campaign.id])).toBe(1);
  });
});

describe('GET /api/imports/:id/problems', () => {
  it('pages through every problem', async () => {
    const campaign = await newCampaign();
    const rows: Cell[][] = [['Campaign', 'Mutations'], ...Array.from({ length: 30 }, (_, index): Cell[] => [campaign.name, `X${index + 1}A`])];
    const checked = await previewed(lead, await uploaded(lead, 'variants', 'many.csv', csv(rows)));
    const page = await lead.agent.get(`/api/imports/${checked.id}/problems?page=2&pageSize=10`).expect(200);
    expect(page.body).toMatchObject({ total: 30, page: 2, pageSize: 10 });
    expect(page.body.rows.map((problem: { row: number }) => problem.row)).toEqual([12, 13, 14, 15, 16, 17, 18, 19, 20, 21]);
    const bad = await lead.agent.get(`/api/imports/${checked.id}/problems?pageSize=5000`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.pageSize).toBe('must be a whole number from 1 to 1000');
    expect(existsSync(testApp.dataDir)).toBe(true);
    await settled(lead, checked.id);
  });
});
