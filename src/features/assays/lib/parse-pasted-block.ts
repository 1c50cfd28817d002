import { matchingName, readHeader } from '@shared/imports/read-header';
import { canonicalUnit, type UnitKind } from '@shared/imports/unit-spelling';

/** A block of cells copied from a spreadsheet, split into rows and columns. */
export interface PastedCells {
  rows: string[][];
  delimiter: '\t' | ';' | ',' | ' ';
}

/**
 * Splits pasted text into cells: tab-separated when any line has a tab (what spreadsheets put on the
 * clipboard), else semicolon- or comma-separated, else runs of spaces. Blank lines are dropped; quotes
 * around a cell are removed.
 */
export function splitPastedText(text: string): PastedCells {
  const lines = text.replace(/\r\n?/g, '\n').split('\n').filter((line) => line.trim() !== '');
  const delimiter: PastedCells['delimiter'] = lines.some((line) => line.includes('\t'))
    ? '\t'
    : lines.some((line) => line.includes(';'))
      ? ';'
      : lines.some((line) => line.includes(','))
        ? ','
        : ' ';
  const rows = lines.map((line) =>
    (delimiter === ' ' ? line.trim().split(/\s+/) : line.split(delimiter)).map((cell) => cell.trim().replace(/^"(.*)"$/, '$1').trim()),
  );
  return { rows, delimiter };
}

/**
 * Reads one number as a spreadsheet writes it: `0.25`, `2.5e-4`, `1 250`, and the decimal comma (`0,25`)
 * when the cells are not comma-separated. Empty text is null; anything else that is not a number is NaN.
 */
export function readPastedNumber(text: string, decimalComma: boolean): number | null {
  let cleaned = text.replace(/[\s\u00a0\u202f]/g, '').replace(/\u2212/g, '-');
  if (cleaned === '') return null;
  if (decimalComma && /^-?\d*,\d+(e[-+]?\d+)?$/i.test(cleaned)) cleaned = cleaned.replace(',', '.');
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(cleaned) ? Number(cleaned) : Number.NaN;
}

/** What the two kinds of block measure. */
export interface BlockKind {
  /** Header names (in matchingName form) that mark the x column. */
  xNames: readonly string[];
  /** Unit kind of x, or null for pH, which has none. */
  xUnitKind: UnitKind | null;
  /** Unit kind of the rate columns. */
  yUnitKind: UnitKind;
}

export const rateBlock: BlockKind = {
  xNames: ['s', 'substrate', 'conc', 'concentration', 'substrateconcentration', 's0'],
  xUnitKind: 'concentration',
  yUnitKind: 'rate',
};

export const phBlock: BlockKind = { xNames: ['ph'], xUnitKind: null, yUnitKind: 'phRate' };

// Summary columns beside the replicates; a mean or SD is not another measurement of the rate.
const SUMMARY_NAMES = /^(mean|average|avg|sd|se|sem|stdev|stddev|std|error|err|n|cv)\b|\b(mean|average|sd|se|sem|stdev|stddev|error)$/;

/** A unit in brackets inside a header such as `v0 (µM/min) rep 1`, when it is one of `kind`. */
function bracketedAnywhere(header: string, kind: UnitKind): string | null {
  for (const match of header.matchAll(/[([]([^()[\]]+)[)\]]/g)) {
    if (canonicalUnit(match[1], kind) !== undefined) return match[1];
  }
  return null;
}

/** A pasted block read as one x column and replicate columns of rates. */
export interface ParsedBlock {
  /** x of each data row and the rates of its replicate columns (null where a cell was empty). */
  rows: { x: number; y: (number | null)[] }[];
  replicateCount: number;
  /** Units read from the header, in the API's spelling. */
  xUnit?: string;
  yUnit?: string;
  /** Things the reader did that a person should know (a skipped column, a title row). */
  notes: string[];
  /** Why some or all of the block could not be read. */
  problems: string[];
}

/**
 * Reads a block pasted from a spreadsheet: optional header rows (the last one names the columns, with
 * units such as `[S] (mM)` or `v0 (µM/min)`, read by the same header and unit readers as imports), then
 * one row per x value: the x column (the first, unless a header names another) and one or more rate
 * columns, each a replicate. Mean and SD columns are skipped.
 *
 * @param text the clipboard text
 * @param kind what the columns measure
 * @returns the rows, the replicate count, the units found, notes and problems
 */
export function parsePastedBlock(text: string, kind: BlockKind): ParsedBlock {
  const { rows: cells, delimiter } = splitPastedText(text);
  const decimalComma = delimiter !== ',';
  const notes: string[] = [];
  const problems: string[] = [];
  const startsWithNumber = (row: string[]) => {
    const value = readPastedNumber(row[0] ?? '', decimalComma);
    return value !== null && !Number.isNaN(value);
  };
  const firstData = cells.findIndex(startsWithNumber);
  if (firstData === -1) return { rows: [], replicateCount: 0, notes, problems: ['No row starts with a number, so there is nothing to read.'] };
  if (firstData > 1) notes.push(`Skipped ${firstData - 1} title row${firstData > 2 ? 's' : ''} above the column names.`);
  const header = firstData > 0 ? cells[firstData - 1] : null;
  const data = cells.slice(firstData);
  const width = Math.max(...data.map((row) => row.length), header?.length ?? 0);

  let xColumn = 0;
  let yColumns = Array.from({ length: width - 1 }, (_, index) => index + 1);
  let xUnit: string | undefined;
  let yUnit: string | undefined;
  if (header) {
    const headers = Array.from({ length: width }, (_, index) => readHeader(header[index] ?? ''));
    const named = headers.findIndex((item) => kind.xNames.includes(item.name) || kind.xNames.includes(matchingName(item.text)));
    if (named > 0) xColumn = named;
    yColumns = [];
    headers.forEach((item, index) => {
      if (index === xColumn) return;
      if (SUMMARY_NAMES.test(item.text.replace(/[([].*$/, '').trim().toLowerCase())) {
        notes.push(`Skipped the column “${item.text}”: a summary, not a replicate.`);
        return;
      }
      if (item.text === '' && data.every((row) => (row[index] ?? '') === '')) return;
      yColumns.push(index);
    });
    const xHeader = headers[xColumn];
    if (kind.xUnitKind && xHeader.unit !== null) {
      xUnit = canonicalUnit(xHeader.unit, kind.xUnitKind);
      if (xUnit === undefined) problems.push(`The unit “${xHeader.unit}” of “${xHeader.text}” is not a concentration Kcatalog converts; choose the unit below.`);
    }
    const yUnits = new Set<string>();
    for (const index of yColumns) {
      const unit = headers[index].unit ?? bracketedAnywhere(headers[index].text, kind.yUnitKind);
      if (unit === null) continue;
      const canonical = canonicalUnit(unit, kind.yUnitKind);
      if (canonical === undefined) problems.push(`The unit “${unit}” of “${headers[index].text}” is not a rate unit Kcatalog converts; choose the unit below.`);
      else yUnits.add(canonical);
    }
    if (yUnits.size > 1) problems.push(`The replicate columns are in different units (${[...yUnits].join(', ')}); paste them in one unit.`);
    if (yUnits.size === 1) yUnit = [...yUnits][0];
  }
  if (yColumns.length === 0) problems.push('The block has no rate column beside the first column.');

  const rows = data.map((row, rowIndex) => {
    const x = readPastedNumber(row[xColumn] ?? '', decimalComma);
    const y = yColumns.map((index, replicate) => {
      const value = readPastedNumber(row[index] ?? '', decimalComma);
      if (value !== null && Number.isNaN(value)) problems.push(`Line ${firstData + rowIndex + 1}, replicate ${replicate + 1}: “${row[index]}” is not a number.`);
      return value !== null && Number.isNaN(value) ? null : value;
    });
    if (x === null || Number.isNaN(x)) problems.push(`Line ${firstData + rowIndex + 1}: “${row[xColumn] ?? ''}” is not a number.`);
    return { x: x ?? Number.NaN, y };
  });
  return {
    rows: rows.filter((row) => !Number.isNaN(row.x)),
    replicateCount: yColumns.length,
    xUnit,
    yUnit,
    notes,
    problems,
  };
}
