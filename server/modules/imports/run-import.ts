import { setImmediate as nextTurn } from 'node:timers/promises';
import type { ImportCountsDto, ImportMode, ImportOutcome, ImportPreviewRowDto } from '@shared/schemas/import';
import type { RowProblem } from './row-reader';

/** How many rows are checked (and written) between two turns of the event loop. */
export const CHUNK_ROWS = 500;
/** Rows shown in the preview. */
export const PREVIEW_ROWS = 20;

/** The result of checking one unit: a row, or the rows of one assay or pH series. */
export interface CheckedUnit<Plan> {
  rows: readonly number[];
  outcome: ImportOutcome;
  problems: RowProblem[];
  /** Each row's values as they will be stored. */
  preview: ImportPreviewRowDto[];
  /** What to write for a new or updated unit. */
  plan: Plan | null;
  /** Versions of the stored records the unit was compared with, by `type:id`. */
  seen: [string, number][];
}

/** One import kind: how rows become units, how a unit is checked, and how checked units are written. */
export interface ImportHandler<Unit, Plan> {
  /** Labels of the preview's columns, with the stored units. */
  readonly previewColumns: readonly string[];
  /**
   * The units in row order, in batches as the rows arrive, each with what its checks compare with loaded; a
   * kind whose units gather rows from anywhere in the sheet gives them in one batch once every row is read.
   */
  units(): AsyncIterable<Unit[]>;
  rowCount(unit: Unit): number;
  /** Checks a unit; its rows' preview values are built only when `preview` is true (the first rows). */
  check(unit: Unit, preview: boolean): CheckedUnit<Plan>;
  write(plans: readonly Plan[]): Promise<void>;
  /** After the last write: derived values such as the variants' summaries. */
  finish(): Promise<void>;
}

/** What a check or a commit found. */
export interface ImportRunResult {
  counts: ImportCountsDto;
  problems: RowProblem[];
  preview: { columns: string[]; rows: ImportPreviewRowDto[] };
  seen: Record<string, number>;
}

/** Thrown inside the commit's transaction so that it rolls back: an all-or-nothing commit met invalid rows. */
export class ImportRolledBack extends Error {
  constructor(readonly result: ImportRunResult) {
    super(`${result.counts.invalid} rows have problems; nothing was imported`);
    this.name = 'ImportRolledBack';
  }
}

export interface RunOptions {
  /** Write the units (inside the caller's transaction), or only check them (preview). */
  write: boolean;
  mode: ImportMode;
  /** Versions seen at the preview: a record changed since then refuses its row. */
  seenAtPreview?: Readonly<Record<string, number>>;
  onProgress: (processed: number, total: number) => Promise<void>;
}

/**
 * Checks every unit and, when writing, writes them chunk by chunk, yielding to the event loop between
 * chunks so that other requests are served while a large sheet is imported. All-or-nothing stops writing at
 * the first invalid unit, checks the rest so that every problem is reported, and then throws
 * {@link ImportRolledBack} so the caller's transaction undoes what was written; valid-only writes every
 * valid unit and reports the others.
 *
 * @param handler the import kind's handler, built on the phase's entity manager
 * @param total the number of data rows
 * @param options write or check only, mode, preview versions, progress callback
 * @throws {ImportRolledBack} in all-or-nothing mode when a unit is invalid and writing was asked for
 * @returns counts, problems, the preview and the versions seen
 */
export async function runImport<Unit, Plan>(handler: ImportHandler<Unit, Plan>, total: number, options: RunOptions): Promise<ImportRunResult> {
  const result: ImportRunResult = {
    counts: { new: 0, updated: 0, unchanged: 0, invalid: 0 },
    problems: [],
    preview: { columns: [...handler.previewColumns], rows: [] },
    seen: {},
  };
  const writing = () => options.write && (options.mode === 'valid-only' || result.counts.invalid === 0);
  let processed = 0;
  for await (const batch of handler.units()) {
    const units: (Unit | undefined)[] = batch;
    let index = 0;
    while (index < units.length) {
      const plans: Plan[] = [];
      let chunkRows = 0;
      while (index < units.length && chunkRows < CHUNK_ROWS) {
        const unit = units[index]!;
        // Checked units are let go as the work goes, so a large sheet's rows do not all stay in memory.
        units[index] = undefined;
        index += 1;
        chunkRows += handler.rowCount(unit);
        const checked = refuseChangedSincePreview(handler.check(unit, result.preview.rows.length < PREVIEW_ROWS), options.seenAtPreview);
        record(result, checked);
        if (checked.plan !== null && checked.outcome !== 'invalid') plans.push(checked.plan);
      }
      if (writing() && plans.length > 0) await handler.write(plans);
      processed += chunkRows;
      await options.onProgress(Math.min(processed, total), total);
      await nextTurn();
    }
  }
  if (options.write && options.mode === 'all-or-nothing' && result.counts.invalid > 0) throw new ImportRolledBack(result);
  if (options.write) await handler.finish();
  return result;
}

function record<Plan>(result: ImportRunResult, checked: CheckedUnit<Plan>): void {
  result.counts[checked.outcome] += checked.rows.length;
  result.problems.push(...checked.problems);
  for (const row of checked.preview) {
    if (result.preview.rows.length >= PREVIEW_ROWS) break;
    result.preview.rows.push(row);
  }
  for (const [key, version] of checked.seen) result.seen[key] = version;
}

function refuseChangedSincePreview<Plan>(checked: CheckedUnit<Plan>, seenAtPreview: Readonly<Record<string, number>> | undefined): CheckedUnit<Plan> {
  if (!seenAtPreview || checked.outcome === 'invalid') return checked;
  const changed = checked.seen.find(([key, version]) => seenAtPreview[key] !== undefined && seenAtPreview[key] !== version);
  if (!changed) return checked;
  const [key, version] = changed;
  const message = `the stored ${key.split(':')[0]} ${key.split(':')[1]} was changed by someone else since the preview (now at version ${version}); preview again`;
  return {
    ...checked,
    outcome: 'invalid',
    plan: null,
    problems: checked.rows.map((row) => ({ row, field: null, message })),
    preview: checked.preview.map((row) => ({ ...row, outcome: 'invalid' })),
  };
}

/**
 * A unit that cannot be imported, with its problems (and, for units of several rows, a pointer on each
 * other row to where the problems are).
 *
 * @param rows the unit's rows
 * @param problems the problems found
 * @param preview the rows' values as far as they were read
 * @returns the invalid unit
 */
export function invalidUnit<Plan>(rows: readonly number[], problems: RowProblem[], preview: ImportPreviewRowDto[] = []): CheckedUnit<Plan> {
  const withProblems = new Set(problems.map((problem) => problem.row));
  const elsewhere = [...withProblems].sort((first, second) => first - second);
  const pointers: RowProblem[] = rows
    .filter((row) => !withProblems.has(row))
    .map((row) => ({ row, field: null, message: `belongs to the same ${rows.length > 1 ? 'assay or series' : 'unit'} as row ${elsewhere.join(', ')}, which has problems` }));
  return {
    rows,
    outcome: 'invalid',
    problems: [...problems, ...pointers].sort((first, second) => first.row - second.row),
    preview: preview.map((row) => ({ ...row, outcome: 'invalid' })),
    plan: null,
    seen: [],
  };
}

/** Yields to the event loop every `every` items of a long synchronous loop. */
export async function yieldEvery(index: number, every = 5000): Promise<void> {
  if (index > 0 && index % every === 0) await nextTurn();
}
