import { readPastedNumber, type ParsedBlock } from './parse-pasted-block';

/** One row of the entry grid as typed: the x value (S or pH) and one rate per replicate column. */
export interface GridRow {
  id: string;
  x: string;
  y: string[];
}

/**
 * The entry grid: rows of typed text, the number of replicate columns, and the excluded points with the
 * reason given (keyed by {@link pointKey}). Text is kept as typed so that a half-typed number stays.
 */
export interface PointGridState {
  rows: GridRow[];
  replicates: number;
  exclusions: Record<string, string>;
}

/** One point ready for a fit: from a row with a number in x and a number in one replicate column. */
export interface GridPoint {
  key: string;
  /** 0-based row of the grid. */
  row: number;
  /** 1-based replicate (the column). */
  replicate: number;
  x: number;
  y: number;
  excluded: boolean;
  reason: string | null;
}

/** A cell whose text cannot be used, with the reason. */
export interface CellProblem {
  /** `rowId:x` or `rowId:<replicate>`. */
  cell: string;
  message: string;
}

/** Most replicate columns the grid offers. */
export const maxReplicates = 12;

let rowCounter = 0;
const newRowId = () => `row-${(rowCounter += 1)}`;

/** The key of a point: its row id and replicate, stable while the rest of the grid is edited. */
export const pointKey = (rowId: string, replicate: number) => `${rowId}:${replicate}`;

/** An empty grid. */
export function emptyGrid(rowCount = 8, replicates = 1): PointGridState {
  return {
    rows: Array.from({ length: rowCount }, () => ({ id: newRowId(), x: '', y: Array.from({ length: replicates }, () => '') })),
    replicates,
    exclusions: {},
  };
}

/** A grid holding a pasted block (and one empty row to go on typing). */
export function gridFromBlock(block: ParsedBlock): PointGridState {
  const replicates = Math.min(maxReplicates, Math.max(1, block.replicateCount));
  const rows = block.rows.map((row) => ({
    id: newRowId(),
    x: String(row.x),
    y: Array.from({ length: replicates }, (_, index) => (row.y[index] === null || row.y[index] === undefined ? '' : String(row.y[index]))),
  }));
  rows.push({ id: newRowId(), x: '', y: Array.from({ length: replicates }, () => '') });
  return { rows, replicates, exclusions: {} };
}

/**
 * Writes one cell. Typing into the last row adds an empty row below, so the grid always has room.
 *
 * @param state the grid
 * @param rowId the row
 * @param column `x` or the 0-based replicate column
 * @param text the new text
 * @returns the new grid
 */
export function setCell(state: PointGridState, rowId: string, column: 'x' | number, text: string): PointGridState {
  const rows = state.rows.map((row) => {
    if (row.id !== rowId) return row;
    if (column === 'x') return { ...row, x: text };
    const y = [...row.y];
    y[column] = text;
    return { ...row, y };
  });
  const last = rows[rows.length - 1];
  if (last.id === rowId && text.trim() !== '') rows.push({ id: newRowId(), x: '', y: Array.from({ length: state.replicates }, () => '') });
  return { ...state, rows };
}

/**
 * Writes a block of cells from a starting cell on, as a spreadsheet pastes: column 0 is x, columns 1… are
 * the replicates; rows and replicate columns are added where the block reaches past the grid.
 *
 * @param state the grid
 * @param rowIndex the 0-based row of the starting cell
 * @param column 0 for x, 1… for replicates
 * @param cells the block's cells
 * @returns the new grid
 */
export function fillCells(state: PointGridState, rowIndex: number, column: number, cells: readonly (readonly string[])[]): PointGridState {
  const widest = Math.max(0, ...cells.map((row) => row.length));
  let next = column + widest - 1 > state.replicates ? setReplicateCount(state, column + widest - 1) : state;
  const rows = [...next.rows];
  while (rows.length < rowIndex + cells.length + 1) rows.push({ id: newRowId(), x: '', y: Array.from({ length: next.replicates }, () => '') });
  next = { ...next, rows };
  cells.forEach((row, offset) => {
    const target = next.rows[rowIndex + offset];
    row.forEach((value, index) => {
      const targetColumn = column + index;
      if (targetColumn - 1 >= next.replicates) return;
      next = setCell(next, target.id, targetColumn === 0 ? 'x' : targetColumn - 1, value);
    });
  });
  return next;
}

/** Adds or removes replicate columns (removing drops their values and exclusions). */
export function setReplicateCount(state: PointGridState, replicates: number): PointGridState {
  const count = Math.min(maxReplicates, Math.max(1, replicates));
  const rows = state.rows.map((row) => ({ ...row, y: Array.from({ length: count }, (_, index) => row.y[index] ?? '') }));
  const exclusions = Object.fromEntries(Object.entries(state.exclusions).filter(([key]) => Number(key.split(':')[1]) <= count));
  return { rows, replicates: count, exclusions };
}

/** Removes a row and its exclusions. */
export function removeRow(state: PointGridState, rowId: string): PointGridState {
  const rows = state.rows.filter((row) => row.id !== rowId);
  const exclusions = Object.fromEntries(Object.entries(state.exclusions).filter(([key]) => !key.startsWith(`${rowId}:`)));
  return { ...state, rows: rows.length > 0 ? rows : emptyGrid(1, state.replicates).rows, exclusions };
}

/** Marks a point excluded with a reason, or includes it again (reason null). */
export function setExclusion(state: PointGridState, key: string, reason: string | null): PointGridState {
  const exclusions = { ...state.exclusions };
  if (reason === null) delete exclusions[key];
  else exclusions[key] = reason;
  return { ...state, exclusions };
}

/**
 * The points of the grid in row order, replicates within a row: the order the server receives them in,
 * so the preview fits exactly what will be saved. Rows without x and rates are skipped; a cell that is
 * not a number, a negative value or a rate without its x is a problem, and its point is left out.
 *
 * @param state the grid
 * @param nouns how the problems name x and y, e.g. `[S]` and `v₀`
 * @returns the points and the cell problems
 */
export function gridPoints(state: PointGridState, nouns: { x: string; y: string; xMax?: number }): { points: GridPoint[]; problems: CellProblem[] } {
  const points: GridPoint[] = [];
  const problems: CellProblem[] = [];
  state.rows.forEach((row, rowIndex) => {
    const filled = row.y.slice(0, state.replicates).some((text) => text.trim() !== '');
    if (row.x.trim() === '' && !filled) return;
    const x = readPastedNumber(row.x, true);
    let xUsable = false;
    if (x === null) problems.push({ cell: `${row.id}:x`, message: `Row ${rowIndex + 1}: enter ${nouns.x} for these rates.` });
    else if (Number.isNaN(x)) problems.push({ cell: `${row.id}:x`, message: `Row ${rowIndex + 1}: ${nouns.x} “${row.x}” is not a number.` });
    else if (x < 0) problems.push({ cell: `${row.id}:x`, message: `Row ${rowIndex + 1}: ${nouns.x} must be at least 0.` });
    else if (nouns.xMax !== undefined && x > nouns.xMax) problems.push({ cell: `${row.id}:x`, message: `Row ${rowIndex + 1}: ${nouns.x} must be at most ${nouns.xMax}.` });
    else xUsable = true;
    for (let column = 0; column < state.replicates; column += 1) {
      const text = row.y[column] ?? '';
      const y = readPastedNumber(text, true);
      if (y === null) continue;
      const cell = `${row.id}:${column + 1}`;
      if (Number.isNaN(y)) {
        problems.push({ cell, message: `Row ${rowIndex + 1}, replicate ${column + 1}: “${text}” is not a number.` });
        continue;
      }
      if (y < 0) {
        problems.push({ cell, message: `Row ${rowIndex + 1}, replicate ${column + 1}: ${nouns.y} must be at least 0; leave out a rate that came out negative.` });
        continue;
      }
      if (!xUsable) continue;
      const key = pointKey(row.id, column + 1);
      const reason = state.exclusions[key];
      points.push({ key, row: rowIndex, replicate: column + 1, x: x!, y, excluded: reason !== undefined, reason: reason ?? null });
    }
  });
  return { points, problems };
}
