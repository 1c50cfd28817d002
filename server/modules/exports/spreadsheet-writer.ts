import { PassThrough } from 'node:stream';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { neutralizeFormula } from '@shared/spreadsheet/neutralize-formula';

/** One cell to write: numbers stay numbers, dates are dates, text is guarded against formula injection. */
export type OutputCell = string | number | boolean | Date | null;

/** A table to write as one sheet (or one CSV file). */
export interface OutputSheet {
  name: string;
  headers: readonly string[];
  rows: Iterable<readonly OutputCell[]>;
}

/** The media types of the two formats. */
export const spreadsheetMediaTypes = {
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  csv: 'text/csv; charset=utf-8',
} as const;

const DATE_FORMAT = 'yyyy-mm-dd';
// Excel limits a sheet name to 31 characters and forbids : \ / ? * [ ].
const SHEET_NAME_LIMIT = 31;

/**
 * Writes sheets as an .xlsx workbook with exceljs's streaming writer (rows go to the zip as they are
 * added, so a large export is never a whole workbook in memory): header row in bold, numbers as numbers,
 * dates as date cells formatted YYYY-MM-DD, yes/no for truth values, and every text cell neutralised
 * against formula injection (OWASP, "CSV Injection").
 *
 * @param sheets the tables
 * @returns the workbook's bytes
 */
export async function workbookBuffer(sheets: readonly OutputSheet[]): Promise<Buffer> {
  const stream = new PassThrough();
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise<void>((resolve, reject) => {
    stream.on('end', resolve);
    stream.on('error', reject);
  });
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ stream, useStyles: true, useSharedStrings: false });
  for (const sheet of sheets) {
    const worksheet = workbook.addWorksheet(sheet.name.replace(/[:\\/?*[\]]/g, ' ').slice(0, SHEET_NAME_LIMIT));
    const header = worksheet.addRow(sheet.headers.map((text) => neutralizeFormula(text)));
    header.font = { bold: true };
    header.commit();
    worksheet.columns.forEach((column, index) => {
      column.width = Math.min(40, Math.max(10, (sheet.headers[index]?.length ?? 10) + 2));
    });
    for (const cells of sheet.rows) {
      const row = worksheet.addRow(cells.map(xlsxValue));
      cells.forEach((cell, index) => {
        if (cell instanceof Date) row.getCell(index + 1).numFmt = DATE_FORMAT;
      });
      row.commit();
    }
    worksheet.commit();
  }
  await workbook.commit();
  await finished;
  return Buffer.concat(chunks);
}

/**
 * Writes one table as CSV (RFC 4180 quoting, CRLF line ends) with a UTF-8 byte-order mark, so that
 * spreadsheet programs read the units' superscripts and µ correctly; dates as YYYY-MM-DD, truth values as
 * yes/no, text cells neutralised against formula injection.
 *
 * @param sheet the table
 * @returns the CSV text
 */
export function csvText(sheet: OutputSheet): string {
  const data: string[][] = [];
  for (const cells of sheet.rows) data.push(cells.map(csvValue));
  return `\ufeff${Papa.unparse({ fields: sheet.headers.map((text) => neutralizeFormula(text)), data }, { newline: '\r\n', escapeFormulae: false })}\r\n`;
}

function xlsxValue(cell: OutputCell): ExcelJS.CellValue {
  if (cell === null) return null;
  if (typeof cell === 'string') return neutralizeFormula(cell);
  if (typeof cell === 'boolean') return cell ? 'yes' : 'no';
  return cell;
}

function csvValue(cell: OutputCell): string {
  if (cell === null) return '';
  if (typeof cell === 'string') return neutralizeFormula(cell);
  if (typeof cell === 'boolean') return cell ? 'yes' : 'no';
  if (cell instanceof Date) return cell.toISOString().slice(0, 10);
  // The shortest text that reads back as the same double, so a CSV round trip is exact.
  return String(cell);
}
