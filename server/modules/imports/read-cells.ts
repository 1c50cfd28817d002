import { canonicalUnit, type UnitKind } from '@shared/imports/unit-spelling';
import { restoreNeutralizedFormula } from '@shared/spreadsheet/neutralize-formula';
import { CellFault, type CellValue } from './read-sheets';

/** A cell read as one type: a value, nothing (empty), or why it cannot be read. */
export type CellRead<T> = { ok: true; value: T | null } | { ok: false; message: string };

const empty = <T>(): CellRead<T> => ({ ok: true, value: null });
const value = <T>(read: T): CellRead<T> => ({ ok: true, value: read });
const problem = <T>(message: string): CellRead<T> => ({ ok: false, message });

// What laboratories write for "no value" in a numeric, date or choice column.
const MISSING_WORDS = new Set(['na', 'n/a', 'n.a.', 'nd', 'n.d.', '-', '–', '—']);
// Decimal notation, then optionally a unit after the number.
const NUMBER_WITH_UNIT = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;
const ISO_DATE = /^(\d{4}-\d{2}-\d{2})(?:[T ][\d:.]+Z?)?$/;

function quoted(cell: CellValue): string {
  const text = cell instanceof Date ? cell.toISOString() : String(cell);
  return `'${text.length > 40 ? `${text.slice(0, 40)}…` : text}'`;
}

function isMissing(cell: CellValue): boolean {
  return cell === null || (typeof cell === 'string' && MISSING_WORDS.has(cell.trim().toLowerCase()));
}

/**
 * A text cell, trimmed; numbers and dates are written out. A single quote that an export put before a
 * formula character is taken off again, so an exported text re-imports unchanged.
 *
 * @param cell the cell
 * @returns the text, or null when empty
 */
export function readTextCell(cell: CellValue): CellRead<string> {
  if (cell instanceof CellFault) return problem(cell.message);
  if (cell === null) return empty();
  if (cell instanceof Date) return value(cell.toISOString().slice(0, 10));
  const text = restoreNeutralizedFormula(String(cell).trim());
  return text === '' ? empty() : value(text);
}

/**
 * A number cell. Text is read in decimal notation only (`1.5`, `2e-3`); a unit written after the number
 * must be the column's unit, since a column holds one unit ("mixed units" are refused, not converted
 * silently). `n.d.`, `NA` and a dash mean no value.
 *
 * @param cell the cell
 * @param columnUnit the column's unit in the API's spelling, if it has one
 * @param kind the kind of unit the field takes
 * @returns the number, or null when empty
 */
export function readNumberCell(cell: CellValue, columnUnit?: string, kind?: UnitKind): CellRead<number> {
  if (cell instanceof CellFault) return problem(cell.message);
  if (isMissing(cell)) return empty();
  if (typeof cell === 'number') return value(cell);
  if (typeof cell === 'boolean' || cell instanceof Date) return problem(`must be a number, got ${quoted(cell)}`);
  const text = String(cell).trim().replace(/\u00a0/g, ' ');
  if (text.includes('±') || text.includes('+/-')) return problem('holds a value with its error; put the error in a column of its own');
  if (DECIMAL_COMMA.test(text)) return problem(`must be a number with a decimal point (${text.replace(',', '.')}), got ${quoted(cell)}`);
  const match = NUMBER_WITH_UNIT.exec(text);
  if (match === null) return problem(`must be a number, got ${quoted(cell)}`);
  const number = Number(match[1]);
  const written = match[2].trim();
  if (written === '') return value(number);
  const unit = kind === undefined ? undefined : canonicalUnit(written, kind);
  if (unit === undefined) return problem(`must be a number, got ${quoted(cell)}`);
  if (columnUnit !== undefined && unit !== columnUnit) {
    return problem(`mixed units: this cell is in ${unit} but the column is in ${columnUnit}; convert it or give it a column of its own`);
  }
  return value(number);
}

/**
 * A whole-number cell (replicates, replicate index).
 *
 * @param cell the cell
 * @returns the integer, or null when empty
 */
export function readIntegerCell(cell: CellValue): CellRead<number> {
  const read = readNumberCell(cell);
  if (!read.ok || read.value === null) return read;
  return Number.isInteger(read.value) ? read : problem(`must be a whole number, got ${quoted(cell)}`);
}

/**
 * A date cell: a spreadsheet date or text written `YYYY-MM-DD` (a time after it is dropped). Other
 * spellings such as `04/03/2026` are refused, since they read differently in different countries.
 *
 * @param cell the cell
 * @returns the day as `YYYY-MM-DD`, or null when empty
 */
export function readDateCell(cell: CellValue): CellRead<string> {
  if (cell instanceof CellFault) return problem(cell.message);
  if (isMissing(cell)) return empty();
  // exceljs reads a date cell as midnight UTC of the day shown.
  if (cell instanceof Date) return value(cell.toISOString().slice(0, 10));
  if (typeof cell === 'number') return problem(`is the number ${cell}; format the cell as a date or write the date as YYYY-MM-DD`);
  const match = ISO_DATE.exec(String(cell).trim());
  if (match === null) return problem(`must be a date written YYYY-MM-DD, got ${quoted(cell)}`);
  return value(match[1]);
}

const TRUE_WORDS = new Set(['true', 'yes', 'y', '1', 'x', 'excluded', 'wahr']);
const FALSE_WORDS = new Set(['false', 'no', 'n', '0', 'included', 'falsch']);

/**
 * A yes/no cell: a spreadsheet truth value, yes/no, true/false, 1/0, or x for yes.
 *
 * @param cell the cell
 * @returns the truth value, or null when empty
 */
export function readBooleanCell(cell: CellValue): CellRead<boolean> {
  if (cell instanceof CellFault) return problem(cell.message);
  if (cell === null) return empty();
  if (typeof cell === 'boolean') return value(cell);
  const word = String(cell).trim().toLowerCase();
  if (TRUE_WORDS.has(word)) return value(true);
  if (FALSE_WORDS.has(word)) return value(false);
  return problem(`must be yes or no, got ${quoted(cell)}`);
}

// Other ways of writing a choice, in the compact form of choiceKey.
const CHOICE_SYNONYMS: Record<string, string> = {
  mm: 'michaelis-menten',
  michaelismenten: 'michaelis-menten',
  si: 'substrate-inhibition',
  'bell-shaped': 'bell',
  'two-ionizations': 'bell',
  'acid-limb': 'acid',
  'base-limb': 'base',
  'kcat/km': 'kcatOverKm',
  v: 'v0',
  verified: 'sequence-verified',
};

function choiceKey(text: string): string {
  return text.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

/**
 * A cell holding one of a field's choices, in any case and with spaces or hyphens.
 *
 * @param cell the cell
 * @param choices the choices as the API spells them
 * @returns the choice in the API's spelling, or null when empty
 */
export function readChoiceCell(cell: CellValue, choices: readonly string[]): CellRead<string> {
  if (cell instanceof CellFault) return problem(cell.message);
  if (isMissing(cell)) return empty();
  const key = choiceKey(String(cell));
  const wanted = CHOICE_SYNONYMS[key] ?? key;
  const choice = choices.find((candidate) => choiceKey(candidate) === choiceKey(wanted));
  return choice === undefined ? problem(`must be one of ${choices.join(', ')}; got ${quoted(cell)}`) : value(choice);
}
