import type { z } from 'zod';
import { readBooleanCell, readChoiceCell, readDateCell, readIntegerCell, readNumberCell, readTextCell, type CellRead } from './read-cells';
import type { SheetRow } from './read-sheets';
import { unitOf, type ResolvedMapping } from './resolve-mapping';

/** Why a row cannot be imported: the row, the field (null for the row as a whole) and the reason. */
export interface RowProblem {
  row: number;
  field: string | null;
  message: string;
}

/**
 * Reads one row's mapped cells by field, collecting a problem for every cell that cannot be read; a field
 * that is not mapped reads as null. Values come out in the column's unit, which the API's converters
 * then take to SI.
 */
export class RowReader {
  readonly problems: RowProblem[] = [];

  constructor(
    readonly mapping: ResolvedMapping,
    readonly row: SheetRow,
  ) {}

  get rowNumber(): number {
    return this.row.rowNumber;
  }

  /** Whether the field is mapped to a column. */
  has(key: string): boolean {
    return this.mapping.has(key);
  }

  /** The unit the field's column is in. */
  unit(key: string): string | undefined {
    return unitOf(this.mapping, key);
  }

  problem(field: string | null, message: string): void {
    this.problems.push({ row: this.row.rowNumber, field, message });
  }

  text(key: string): string | null {
    return this.read(key, readTextCell);
  }

  number(key: string): number | null {
    const column = this.mapping.get(key);
    return this.read(key, (cell) => readNumberCell(cell, this.unit(key), column?.field.unitKind));
  }

  integer(key: string): number | null {
    return this.read(key, readIntegerCell);
  }

  date(key: string): string | null {
    return this.read(key, readDateCell);
  }

  boolean(key: string): boolean | null {
    return this.read(key, readBooleanCell);
  }

  choice(key: string): string | null {
    const choices = this.mapping.get(key)?.field.choices ?? [];
    return this.read(key, (cell) => readChoiceCell(cell, choices));
  }

  /** A required field: null, with an `is required` problem, when empty. */
  required<T>(key: string, value: T | null): T | null {
    if (value === null && this.has(key) && !this.problems.some((problem) => problem.field === key)) this.problem(key, 'is required');
    return value;
  }

  private read<T>(key: string, reader: (cell: SheetRow['cells'][number]) => CellRead<T>): T | null {
    const column = this.mapping.get(key);
    if (!column) return null;
    const read = reader(this.row.cells[column.column] ?? null);
    if (read.ok) return read.value;
    this.problem(key, read.message);
    return null;
  }
}

/**
 * Turns the issues of an API schema into row problems, naming the import field each issue's path maps to.
 *
 * @param issues the schema's issues
 * @param fieldOf the import field of a path, or null for the row as a whole
 * @param rowOf the row of a path (a rate point's row within its assay), or undefined for the unit's first row
 * @param firstRow the unit's first row
 * @returns one problem per issue
 */
export function issuesToProblems(
  issues: readonly z.core.$ZodIssue[],
  fieldOf: (path: readonly PropertyKey[]) => string | null,
  firstRow: number,
  rowOf: (path: readonly PropertyKey[]) => number | undefined = () => undefined,
): RowProblem[] {
  return issues.map((issue) => ({ row: rowOf(issue.path) ?? firstRow, field: fieldOf(issue.path), message: issue.message }));
}
