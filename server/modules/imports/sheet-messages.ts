import { HttpError } from '../../http/errors';
import type { CheckedUpload } from './check-upload';
import { CellFault, type CellValue, type SheetRow, type SheetSurvey } from './read-sheets';

/**
 * What the main thread and the spreadsheet reader thread send each other. Messages are copied with the
 * structured clone algorithm, which keeps dates and maps but not classes: a cell fault travels as
 * `{ fault }`, an error as its fields, and a Buffer arrives as a plain Uint8Array.
 */

/** A cell as it travels between threads. */
type WireCell = Exclude<CellValue, CellFault> | { fault: string };

export interface WireRow {
  rowNumber: number;
  cells: WireCell[];
}

export type WireUpload = { format: 'xlsx'; buffer: Uint8Array; sheetNames: Map<number, string> } | { format: 'csv'; buffer: Uint8Array; text: string };

/** Work for the reader thread. */
export type ReadTask =
  | { kind: 'survey'; upload: WireUpload; csvSheetName: string }
  | { kind: 'rows'; upload: WireUpload; sheetName: string; columns: number[] | undefined; batchSize: number };

export type SheetTask = (ReadTask & { id: number }) | { id: number; kind: 'cancel' };

export interface WireError {
  message: string;
  http?: { status: number; code: string; fields?: Record<string, string> };
}

export type SheetReply =
  | { id: number; kind: 'surveyed'; surveys: SheetSurvey[] }
  | { id: number; kind: 'header'; headers: string[] }
  | { id: number; kind: 'rows'; rows: WireRow[] }
  | { id: number; kind: 'done' }
  | { id: number; kind: 'failed'; error: WireError };

export function toWireRows(rows: readonly SheetRow[]): WireRow[] {
  return rows.map(({ rowNumber, cells }) => ({ rowNumber, cells: cells.map((cell) => (cell instanceof CellFault ? { fault: cell.message } : cell)) }));
}

export function fromWireRows(rows: readonly WireRow[]): SheetRow[] {
  return rows.map(({ rowNumber, cells }) => ({
    rowNumber,
    cells: cells.map((cell) => (cell !== null && typeof cell === 'object' && !(cell instanceof Date) ? new CellFault(cell.fault) : cell)),
  }));
}

export function fromWireUpload(upload: WireUpload): CheckedUpload {
  const buffer = Buffer.from(upload.buffer.buffer, upload.buffer.byteOffset, upload.buffer.byteLength);
  return upload.format === 'xlsx' ? { format: 'xlsx', buffer, sheetNames: upload.sheetNames } : { format: 'csv', buffer, text: upload.text };
}

export function toWireError(error: unknown): WireError {
  if (error instanceof HttpError) return { message: error.message, http: { status: error.status, code: error.code, fields: error.fields } };
  return { message: error instanceof Error ? error.message : String(error) };
}

export function fromWireError(error: WireError): Error {
  return error.http ? new HttpError(error.http.status, error.http.code, error.message, error.http.fields) : new Error(error.message);
}
