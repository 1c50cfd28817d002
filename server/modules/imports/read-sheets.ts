import { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { maxImportRows, maxUncompressedWorkbookBytes } from '@shared/imports/import-limits';
import { HttpError } from '../../http/errors';
import type { CheckedUpload } from './check-upload';
import { withPartsFirst } from './zip-central-directory';

/** A cell the spreadsheet holds but that has no usable value (an error, a formula never calculated). */
export class CellFault {
  constructor(readonly message: string) {}
}

/** One cell as read: empty, text, a number, a date, a truth value, or a fault. */
export type CellValue = null | string | number | boolean | Date | CellFault;

/** One data row: its number as the spreadsheet shows it and its cells by 0-based column. */
export interface SheetRow {
  rowNumber: number;
  cells: CellValue[];
}

/** A sheet's name, header row and number of data rows. */
export interface SheetSurvey {
  name: string;
  headers: string[];
  rowCount: number;
}

/**
 * What the streaming reader needs for dates: number formats (styles) and shared strings; entry events only to
 * learn which part each worksheet comes from.
 */
const READER_OPTIONS = { worksheets: 'emit', sharedStrings: 'cache', styles: 'cache', hyperlinks: 'ignore', entries: 'emit' } as const;
/**
 * What exceljs's streaming reader must have read before a worksheet: the workbook (without it the reader
 * fails on the first worksheet), its relationships, styles (for dates) and shared strings (without them it
 * copies each worksheet to a temporary file and parses it at the end). Spreadsheet programs and exceljs's own
 * writer put several of these after the worksheets, so the archive is handed to the reader reordered.
 */
const READER_FIRST_PARTS = ['[Content_Types].xml', '_rels/.rels', 'xl/workbook.xml', 'xl/_rels/workbook.xml.rels', 'xl/styles.xml', 'xl/sharedStrings.xml'];
const isWorksheetPart = (name: string) => /^xl\/worksheets\/sheet\d+\.xml$/.test(name);
/**
 * exceljs's streaming reader (over unzipper 0.10) now and then ends its walk of the archive before the last
 * parts, which are why the worksheets come right after the parts above (theme and document properties last).
 * A read that fails before anything reached its visitor is started again; after that, it is refused.
 */
const READ_ATTEMPTS = 3;

interface ExcelRow {
  number: number;
  values: unknown[] | Record<string, unknown>;
}

function tooManyRows(sheet: string): HttpError {
  const message = `sheet ${sheet} has more than ${maxImportRows.toLocaleString('en-US')} data rows; split it into several files`;
  return new HttpError(400, 'validation_error', `The file cannot be imported: ${message}.`, { file: message });
}

/**
 * Every sheet's name, header row (the first row with any content) and count of data rows below it,
 * refusing a sheet with more than {@link maxImportRows} data rows. Workbooks are read with exceljs's
 * streaming reader, so a large sheet is never held in memory as a whole.
 *
 * @param upload the checked upload
 * @param csvSheetName the name a CSV file's single sheet is shown under
 * @throws {HttpError} 400 for too many rows or an unreadable file
 * @returns the sheets in workbook order
 */
export async function surveySheets(upload: CheckedUpload, csvSheetName: string): Promise<SheetSurvey[]> {
  const surveys: SheetSurvey[] = [];
  let current: SheetSurvey | null = null;
  // No cells are kept: the survey only counts rows.
  await readRows(upload, csvSheetName, [], {
    onSheet: (name) => {
      current = { name, headers: [], rowCount: 0 };
      surveys.push(current);
      return true;
    },
    onHeader: (headers) => {
      current!.headers = headers;
    },
    onRow: () => {
      current!.rowCount += 1;
      if (current!.rowCount > maxImportRows) throw tooManyRows(current!.name);
    },
  });
  if (upload.format === 'csv') return surveys;
  // In the workbook's order, which is the order of the tabs, not of the parts in the file.
  const order = [...upload.sheetNames.values()];
  const position = (name: string) => (order.includes(name) ? order.indexOf(name) : order.length);
  return surveys.sort((first, second) => position(first.name) - position(second.name));
}

/**
 * The header row and data rows of one sheet, handed over in batches as they are read, so that the rows
 * can be checked and written while the rest of the file is still being parsed. Only the columns in
 * `columns` are kept in each row, so a wide sheet costs memory only for the columns mapped.
 *
 * @param upload the checked upload
 * @param sheetName the sheet to read (a CSV file has one, whatever its name)
 * @param columns 0-based columns to keep; all when omitted
 * @param receiver gets the header texts once, then the data rows (rows without any content are skipped) in order
 * @param batchSize rows a batch
 * @throws {HttpError} 400 when the sheet is missing, has too many rows or cannot be read
 */
export async function readSheetInBatches(
  upload: CheckedUpload,
  sheetName: string,
  columns: readonly number[] | undefined,
  receiver: { onHeader: (headers: string[]) => void; onRows: (rows: SheetRow[]) => void },
  batchSize: number,
): Promise<void> {
  let found = false;
  let rowCount = 0;
  let batch: SheetRow[] = [];
  await readRows(upload, sheetName, columns, {
    onSheet: (name) => {
      const wanted = upload.format === 'csv' || name === sheetName;
      found ||= wanted;
      return wanted;
    },
    onHeader: receiver.onHeader,
    onRow: (row) => {
      rowCount += 1;
      if (rowCount > maxImportRows) throw tooManyRows(sheetName);
      batch.push(row);
      if (batch.length >= batchSize) {
        receiver.onRows(batch);
        batch = [];
      }
    },
  });
  if (!found) throw new HttpError(400, 'validation_error', `The file has no sheet named ${sheetName}.`, { sheet: `no sheet is named ${sheetName}` });
  if (batch.length > 0) receiver.onRows(batch);
}

/** Every row of a sheet read in batches, in order. */
export async function allRows(batches: AsyncIterable<SheetRow[]>): Promise<SheetRow[]> {
  const rows: SheetRow[] = [];
  for await (const batch of batches) for (const row of batch) rows.push(row);
  return rows;
}

interface RowVisitor {
  /** Return false to skip the sheet's rows. */
  onSheet: (name: string) => boolean;
  onHeader: (headers: string[]) => void;
  /** A row with content, with the cells of the columns asked for (all when none were named). */
  onRow: (row: SheetRow) => void;
}

async function readRows(upload: CheckedUpload, csvSheetName: string, columns: readonly number[] | undefined, visitor: RowVisitor): Promise<void> {
  if (upload.format === 'csv') {
    readCsvRows(upload.text, csvSheetName, columns, visitor);
    return;
  }
  const archive = withPartsFirst(upload.buffer, maxUncompressedWorkbookBytes, READER_FIRST_PARTS, isWorksheetPart);
  for (let attempt = 1; ; attempt += 1) {
    // Whether anything reached the visitor: until then a failed read can start over unnoticed.
    let reached = false;
    const watched: RowVisitor = {
      onSheet: (name) => ((reached = true), visitor.onSheet(name)),
      onHeader: (headers) => ((reached = true), visitor.onHeader(headers)),
      onRow: (row) => ((reached = true), visitor.onRow(row)),
    };
    try {
      const sheetsRead = await readWorkbookRows(upload, archive, columns, watched);
      if (sheetsRead < upload.sheetNames.size) throw new Error(`the reader handed over ${sheetsRead} of ${upload.sheetNames.size} worksheets`);
      return;
    } catch (error) {
      if (error instanceof HttpError) throw error;
      if (reached || attempt === READ_ATTEMPTS) {
        const message = 'the workbook could not be read (it may be damaged)';
        throw new HttpError(400, 'validation_error', `The file cannot be imported: ${message}.`, { file: message });
      }
    }
  }
}

/** Walks the workbook's worksheets with exceljs's streaming reader; returns how many it handed over. */
async function readWorkbookRows(upload: CheckedUpload & { format: 'xlsx' }, archive: Buffer, columns: readonly number[] | undefined, visitor: RowVisitor): Promise<number> {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from(archive), READER_OPTIONS);
  // exceljs names a worksheet only when it happened to read the workbook's parts first, so the name comes from
  // the check of the upload, by the part number the reader announces just before it hands the worksheet over.
  let part: number | null = null;
  (reader as unknown as NodeJS.EventEmitter).on('entry', (entry: { type?: string; id?: string | number }) => {
    if (entry.type === 'worksheet') part = Number(entry.id);
  });
  let sheetsRead = 0;
  for await (const worksheet of reader) {
    sheetsRead += 1;
    const sheet = worksheet as unknown as AsyncIterable<ExcelRow> & { name: string };
    const wanted = visitor.onSheet((part === null ? undefined : upload.sheetNames.get(part)) ?? sheet.name);
    let headerSeen = false;
    for await (const row of sheet) {
      if (!wanted || !Array.isArray(row.values) || !hasExcelContent(row.values)) continue;
      if (!headerSeen) {
        visitor.onHeader(excelCells(row.values).map(headerText));
        headerSeen = true;
        continue;
      }
      // Only the columns asked for are converted: the rest of a wide sheet costs nothing a row.
      visitor.onRow({ rowNumber: row.number, cells: columns === undefined ? excelCells(row.values) : excelCellsAt(row.values, columns) });
    }
  }
  return sheetsRead;
}

function readCsvRows(text: string, sheetName: string, columns: readonly number[] | undefined, visitor: RowVisitor): void {
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false });
  const quoteError = parsed.errors.find((error) => error.type === 'Quotes');
  if (quoteError) {
    const message = `a quoted field is not closed (near row ${(quoteError.row ?? 0) + 1})`;
    throw new HttpError(400, 'validation_error', `The file cannot be imported: ${message}.`, { file: message });
  }
  visitor.onSheet(sheetName);
  let headerSeen = false;
  parsed.data.forEach((record, index) => {
    const cells: CellValue[] = record.map((cell) => (cell.trim() === '' ? null : cell));
    if (!cells.some((cell) => cell !== null)) return;
    if (!headerSeen) {
      visitor.onHeader(cells.map(headerText));
      headerSeen = true;
      return;
    }
    // One CSV record is one spreadsheet row, even where a quoted field spans lines.
    visitor.onRow({ rowNumber: index + 1, cells: columns === undefined ? cells : cellsAt(cells, columns) });
  });
}

// The cells of some columns, by 0-based column; a column past the row's end is empty.
function cellsAt(cells: readonly CellValue[], columns: readonly number[]): CellValue[] {
  const kept: CellValue[] = [];
  for (const column of columns) kept[column] = cells[column] ?? null;
  return kept;
}

// exceljs gives row.values 1-based (index 0 unused) and sparse.
function excelCells(values: readonly unknown[]): CellValue[] {
  const cells: CellValue[] = [];
  for (let index = 1; index < values.length; index += 1) cells.push(excelCell(values[index]));
  return cells;
}

function excelCellsAt(values: readonly unknown[], columns: readonly number[]): CellValue[] {
  const kept: CellValue[] = [];
  for (const column of columns) kept[column] = excelCell(values[column + 1]);
  return kept;
}

function hasExcelContent(values: readonly unknown[]): boolean {
  for (let index = 1; index < values.length; index += 1) if (excelCell(values[index]) !== null) return true;
  return false;
}

function excelCell(value: unknown): CellValue {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value.trim() === '' ? null : value;
  if (typeof value === 'number') return Number.isFinite(value) ? value : new CellFault('is not a finite number');
  if (typeof value === 'boolean') return value;
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? new CellFault('is not a valid date') : value;
  if (typeof value === 'object') {
    const object = value as Record<string, unknown>;
    if (Array.isArray(object.richText)) {
      const text = (object.richText as { text?: unknown }[]).map((part) => (typeof part.text === 'string' ? part.text : '')).join('');
      return text.trim() === '' ? null : text;
    }
    if ('formula' in object || 'sharedFormula' in object) {
      if (object.result === undefined || object.result === null) {
        return new CellFault('is a formula without a stored result; open the file in a spreadsheet program and save it again');
      }
      return excelCell(object.result);
    }
    if (typeof object.error === 'string') return new CellFault(`holds the spreadsheet error ${object.error}`);
    if (typeof object.text === 'string') return object.text.trim() === '' ? null : object.text;
  }
  return new CellFault('holds a value that is neither text, a number nor a date');
}

function headerText(cell: CellValue): string {
  if (cell === null || cell instanceof CellFault) return '';
  if (cell instanceof Date) return cell.toISOString().slice(0, 10);
  return String(cell).replace(/\s+/g, ' ').trim();
}
