import { createHash } from 'node:crypto';
import { extname } from 'node:path';
import { maxImportBytes, maxUncompressedWorkbookBytes } from '@shared/schemas/import';
import { HttpError } from '../../http/errors';
import { workbookSheetNames } from './workbook-sheet-names';
import { readZipCentralDirectory, verifyInflatedSizes, ZipRefusal } from './zip-central-directory';

/** Media types stored with the attachment. */
export const importMediaTypes = {
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  csv: 'text/csv',
} as const;

/**
 * An upload whose content is a workbook or UTF-8 text, as its name says; a workbook with its sheet names by
 * part number (`xl/worksheets/sheetN.xml`), in the workbook's order.
 */
export type CheckedUpload = { format: 'xlsx'; buffer: Buffer; sheetNames: Map<number, string> } | { format: 'csv'; buffer: Buffer; text: string };

// The parts every SpreadsheetML package has (ECMA-376 Part 2, Open Packaging Conventions §10.1.2; Part 1 §12.3.23).
const CONTENT_TYPES_PART = '[Content_Types].xml';
const WORKBOOK_PART = 'xl/workbook.xml';
const WORKBOOK_RELATIONSHIPS_PART = 'xl/_rels/workbook.xml.rels';
const WORKBOOK_CONTENT_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml';
const MACRO_WORKBOOK_CONTENT_TYPE = 'application/vnd.ms-excel.sheet.macroEnabled.main+xml';

const ZIP_SIGNATURE = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
// OLE2 compound file (MS-CFB §2.2): legacy .xls, and also what Excel makes of a password-protected .xlsx.
const COMPOUND_FILE_SIGNATURE = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);
const UTF8_BOM = Buffer.from([0xef, 0xbb, 0xbf]);

function refuse(message: string): HttpError {
  return new HttpError(400, 'validation_error', `The file cannot be imported: ${message}.`, { file: message });
}

/**
 * Checks an upload by its content, not its name: at most {@link maxImportBytes}; a `.xlsx` must be a ZIP
 * package with the SpreadsheetML parts (not a macro-enabled workbook, not an OLE2 file such as a legacy
 * `.xls` or an encrypted workbook), whose central directory declares at most
 * {@link maxUncompressedWorkbookBytes} unpacked and whose parts really inflate to no more than declared;
 * a `.csv` must be UTF-8 text without NUL bytes. A name that does not match the content is refused too.
 *
 * @param file the original name and the bytes
 * @throws {HttpError} 400 on `file`, saying what is wrong
 * @returns the format, the bytes, and the sheet names of a workbook or the decoded text (without a byte-order mark) of a CSV file
 */
export async function checkUpload(file: { originalName: string; buffer: Buffer }): Promise<CheckedUpload> {
  const { buffer } = file;
  const extension = extname(file.originalName).toLowerCase();
  if (buffer.length === 0) throw refuse('it is empty');
  if (buffer.length > maxImportBytes) throw refuse(`it is ${megabytes(buffer.length)} MB; the limit is ${megabytes(maxImportBytes)} MB`);
  if (extension !== '.xlsx' && extension !== '.csv') {
    throw refuse(`only .xlsx workbooks and .csv files are imported, not ${extension === '' ? 'files without an extension' : extension}`);
  }
  const looksZip = buffer.subarray(0, 4).equals(ZIP_SIGNATURE);
  const looksCompound = buffer.subarray(0, 8).equals(COMPOUND_FILE_SIGNATURE);

  if (extension === '.xlsx') {
    if (looksCompound) throw refuse('it is a legacy .xls workbook or a password-protected one; save it as an .xlsx workbook without a password');
    if (!looksZip) throw refuse('it is named .xlsx but is not an Excel workbook (its content is no ZIP package)');
    return { format: 'xlsx', buffer, sheetNames: await checkWorkbookPackage(buffer, true) };
  }
  if (looksZip || looksCompound) throw refuse('it is named .csv but holds a workbook; name it .xlsx or save the sheet as CSV');
  return { format: 'csv', buffer, text: decodeCsv(buffer) };
}

/**
 * An upload read back from storage to work on it. When its bytes still hash to the SHA-256 recorded at
 * upload, they are the very bytes {@link checkUpload} passed, so a workbook's parts are not all inflated a
 * second time (only the parts that name its sheets are read); any other file is checked in full again.
 *
 * @param file the original name and the stored bytes
 * @param sha256 the SHA-256 (hex) the file was stored under
 * @throws {HttpError} 400 on `file`, saying what is wrong
 * @returns as {@link checkUpload}
 */
export async function reopenUpload(file: { originalName: string; buffer: Buffer }, sha256: string): Promise<CheckedUpload> {
  const workbook = extname(file.originalName).toLowerCase() === '.xlsx';
  if (!workbook || createHash('sha256').update(file.buffer).digest('hex') !== sha256) return checkUpload(file);
  return { format: 'xlsx', buffer: file.buffer, sheetNames: await checkWorkbookPackage(file.buffer, false) };
}

const NAMING_PARTS = [CONTENT_TYPES_PART, WORKBOOK_PART, WORKBOOK_RELATIONSHIPS_PART];

async function checkWorkbookPackage(buffer: Buffer, inflateEveryPart: boolean): Promise<Map<number, string>> {
  try {
    const entries = readZipCentralDirectory(buffer, maxUncompressedWorkbookBytes);
    const names = new Set(entries.map((entry) => entry.name));
    if (!names.has(CONTENT_TYPES_PART) || !names.has(WORKBOOK_PART)) {
      throw new ZipRefusal('it is a ZIP archive but not an Excel workbook (it has no xl/workbook.xml)');
    }
    const inflated = inflateEveryPart ? entries : entries.filter((entry) => NAMING_PARTS.includes(entry.name));
    const kept = await verifyInflatedSizes(buffer, inflated, NAMING_PARTS);
    const contentTypes = kept.get(CONTENT_TYPES_PART)?.toString('utf8') ?? '';
    if (contentTypes.includes(MACRO_WORKBOOK_CONTENT_TYPE)) throw new ZipRefusal('it is a macro-enabled workbook; save it as a plain .xlsx workbook');
    if (!contentTypes.includes(WORKBOOK_CONTENT_TYPE)) throw new ZipRefusal('it is a ZIP package but not an .xlsx workbook');
    return workbookSheetNames(kept.get(WORKBOOK_PART)?.toString('utf8') ?? '', kept.get(WORKBOOK_RELATIONSHIPS_PART)?.toString('utf8') ?? '');
  } catch (error) {
    if (error instanceof ZipRefusal) throw refuse(error.message);
    throw error;
  }
}

function decodeCsv(buffer: Buffer): string {
  if ((buffer[0] === 0xff && buffer[1] === 0xfe) || (buffer[0] === 0xfe && buffer[1] === 0xff)) {
    throw refuse('it is UTF-16 text; save it as CSV UTF-8');
  }
  if (buffer.includes(0)) throw refuse('it contains NUL bytes, so it is binary data rather than CSV text');
  const body = buffer.subarray(0, 3).equals(UTF8_BOM) ? buffer.subarray(3) : buffer;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(body);
  } catch {
    throw refuse('it is not UTF-8 text; save it as CSV UTF-8');
  }
}

function megabytes(bytes: number): string {
  return (bytes / 1024 / 1024).toFixed(1).replace(/\.0$/, '');
}
