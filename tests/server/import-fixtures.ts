/**
 * Spreadsheet builders and job helpers for the import and export tests. All data is invented.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { Test } from 'supertest';
import { expect } from 'vitest';
import type { ColumnMapping, ImportJobDto, ImportKind } from '@shared/schemas/import';
import type { Session } from './role-sessions';

export type Cell = string | number | boolean | Date | null;

/** An .xlsx workbook with one or more sheets of rows (the first row of each is its header). */
export async function workbook(sheets: Record<string, Cell[][]>): Promise<Buffer> {
  const book = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) {
    const sheet = book.addWorksheet(name);
    for (const row of rows) {
      const added = sheet.addRow(row);
      row.forEach((cell, index) => {
        if (cell instanceof Date) added.getCell(index + 1).numFmt = 'yyyy-mm-dd';
      });
    }
  }
  return Buffer.from(await book.xlsx.writeBuffer());
}

/** A CSV file of rows, UTF-8. */
export function csv(rows: Cell[][]): Buffer {
  return Buffer.from(Papa.unparse(rows.map((row) => row.map((cell) => (cell instanceof Date ? cell.toISOString().slice(0, 10) : cell === null ? '' : String(cell))))), 'utf8');
}

/** Reads every sheet of an .xlsx workbook into rows of cell values (1-based values flattened to 0-based). */
export async function readWorkbook(buffer: Buffer): Promise<Record<string, unknown[][]>> {
  const book = new ExcelJS.Workbook();
  await book.xlsx.load(buffer as unknown as ArrayBuffer);
  const sheets: Record<string, unknown[][]> = {};
  book.eachSheet((sheet) => {
    const rows: unknown[][] = [];
    sheet.eachRow({ includeEmpty: false }, (row) => {
      const values = row.values as unknown[];
      rows.push(values.slice(1).map((value) => value ?? null));
    });
    sheets[sheet.name] = rows;
  });
  return sheets;
}

/** A supertest parser that reads a file download into a Buffer. */
export const binary: Parameters<Test['parse']>[0] = (response, callback) => {
  // In Node the response handed to a parser is the incoming message stream.
  const stream = response as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => callback(null, Buffer.concat(chunks)));
};

/** Uploads a file as the given session. */
export function upload(session: Session, kind: ImportKind | string, name: string, content: Buffer) {
  return session.agent.post('/api/imports').set('X-CSRF-Token', session.csrfToken).field('kind', kind).attach('file', content, name);
}

/** Uploads and expects the job to be created. */
export async function uploaded(session: Session, kind: ImportKind, name: string, content: Buffer): Promise<ImportJobDto> {
  const response = await upload(session, kind, name, content);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.job as ImportJobDto;
}

/** Polls the job until its background work has finished. */
export async function settled(session: Session, id: number): Promise<ImportJobDto> {
  for (let attempt = 0; attempt < 2000; attempt += 1) {
    const { body } = await session.agent.get(`/api/imports/${id}`).expect(200);
    const job = body.job as ImportJobDto;
    if (job.status !== 'validating' && job.status !== 'committing') return job;
    await new Promise((done) => setTimeout(done, 20));
  }
  throw new Error(`import ${id} did not finish`);
}

/** Previews with the suggested mapping of the first sheet (or the given one) and waits for the result. */
export async function previewed(
  session: Session,
  job: ImportJobDto,
  options: { sheet?: string; columns?: ColumnMapping; campaignId?: number } = {},
): Promise<ImportJobDto> {
  const sheet = job.sheets.find((candidate) => candidate.name === (options.sheet ?? job.sheets[0].name))!;
  const response = await session.agent
    .post(`/api/imports/${job.id}/preview`)
    .set('X-CSRF-Token', session.csrfToken)
    .send({ version: job.version, sheet: sheet.name, columns: options.columns ?? sheet.suggested.columns, campaignId: options.campaignId });
  expect(response.status, JSON.stringify(response.body)).toBe(202);
  return settled(session, job.id);
}

/** Commits a previewed job and waits for the result. */
export async function committed(session: Session, job: ImportJobDto, mode: 'all-or-nothing' | 'valid-only' = 'all-or-nothing'): Promise<ImportJobDto> {
  const response = await session.agent.post(`/api/imports/${job.id}/commit`).set('X-CSRF-Token', session.csrfToken).send({ version: job.version, mode });
  expect(response.status, JSON.stringify(response.body)).toBe(202);
  return settled(session, job.id);
}

/** Upload, preview with the suggested mapping, commit: the whole journey. */
export async function imported(
  session: Session,
  kind: ImportKind,
  name: string,
  content: Buffer,
  options: { sheet?: string; columns?: ColumnMapping; campaignId?: number; mode?: 'all-or-nothing' | 'valid-only' } = {},
): Promise<ImportJobDto> {
  const job = await uploaded(session, kind, name, content);
  const checked = await previewed(session, job, options);
  expect(checked.status, JSON.stringify(checked.problems.slice(0, 5))).toBe('previewed');
  const result = await committed(session, checked, options.mode);
  expect(result.status, `${result.message} ${JSON.stringify(result.problems.slice(0, 5))}`).toBe('committed');
  return result;
}
