import { basename, extname } from 'node:path';
import { notFound } from '../../http/errors';
import { workbookBuffer, type OutputCell } from '../exports/spreadsheet-writer';
import { ImportJob } from './import-job.entity';
import { loadUpload, type ImportStorage } from './imports.service';
import { CellFault } from './read-sheets';
import { readWholeSheet } from './sheet-reader';

/**
 * The rows a valid-only commit did not import, as a workbook to fix and import again: the original sheet's
 * header and cells of every rejected row, then the row's number in the original sheet and the reasons
 * (`column: reason; …`).
 *
 * @param storage data source and data folder
 * @param id the job
 * @throws {HttpError} 404 when the job has no rejected rows
 * @returns the file name and the .xlsx bytes
 */
export async function rejectedRowsWorkbook(storage: ImportStorage, id: number): Promise<{ fileName: string; buffer: Buffer }> {
  const job = await storage.dataSource.getRepository(ImportJob).findOneBy({ id });
  if (!job || job.status !== 'committed' || job.mode !== 'valid-only' || job.invalidRows === 0 || job.sheetName === null) {
    throw notFound('A rejected-rows file for this import');
  }
  const reasons = new Map<number, string[]>();
  for (const problem of job.problems) {
    if (problem.row === null) continue;
    const text = problem.column === null ? problem.message : `${problem.column}: ${problem.message}`;
    reasons.set(problem.row, [...(reasons.get(problem.row) ?? []), text]);
  }
  const { headers, rows } = await readWholeSheet(await loadUpload(storage, job), job.sheetName);
  const width = Math.max(headers.length, ...rows.map((row) => row.cells.length));
  const output: OutputCell[][] = rows
    .filter((row) => reasons.has(row.rowNumber))
    .map((row) => [
      ...Array.from({ length: width }, (_, column) => {
        const cell = row.cells[column] ?? null;
        return cell instanceof CellFault ? null : cell;
      }),
      row.rowNumber,
      reasons.get(row.rowNumber)!.join('; '),
    ]);
  const paddedHeaders = Array.from({ length: width }, (_, column) => headers[column] ?? '');
  const buffer = await workbookBuffer([{ name: 'Rejected rows', headers: [...paddedHeaders, 'Row in original', 'Reason'], rows: output }]);
  return { fileName: `${basename(job.fileName, extname(job.fileName))}-rejected.xlsx`, buffer };
}
