import { importFields, type ColumnMapping, type ImportField, type ImportKind } from '../schemas/import';
import { matchingName, readHeader, type ReadHeader } from './read-header';
import { canonicalUnit } from './unit-spelling';

/** A mapping remembered for a user and kind: field key → the header it was read from and the unit chosen. */
export type RememberedMapping = Record<string, { header: string; unit?: string }>;

/** A mapping offered for a sheet, and where each field's column came from. */
export interface SuggestedMapping {
  columns: ColumnMapping;
  source: Record<string, 'saved' | 'detected'>;
}

// A bare error column right after a value column ("kcat (1/s) | SE | Km (mM) | SE"), a common layout.
const BARE_ERROR_NAMES = new Set(['se', '±', '±se', 'error', 'stderr', 'standarderror']);

/**
 * Offers a column for every field of an import kind from the sheet's header row.
 *
 * A remembered mapping comes first: each field whose remembered header is present again (compared in
 * matching form) keeps it, with the remembered unit unless the header now names one. Every other field is
 * detected from the header names (`Km (mM)`, `kcat [1/s]`, `kcat/Km (M-1 s-1)`): a header matches a field
 * through the field's aliases, and where a name fits several fields the unit written in the header decides
 * (`Substrate` is the substrate's name, `Substrate (mM)` its concentration; `Buffer` the buffer's name,
 * `Buffer (mM)` its concentration). A bare `SE` or `±` column takes the error of the value column just
 * before it. Columns are taken left to right; no column serves two fields.
 *
 * @param kind the import kind
 * @param headers the header row's texts, by column
 * @param remembered the user's saved mapping for this kind, if any
 * @returns field key → `{ column, unit? }` and the source of each
 * @example
 * detectColumns('measurements', ['Variant', 'Km (mM)', 'SE']).columns
 * // { variant: { column: 0 }, km: { column: 1, unit: 'mM' }, kmSe: { column: 2, unit: 'mM' } }
 */
export function detectColumns(kind: ImportKind, headers: readonly string[], remembered?: RememberedMapping): SuggestedMapping {
  const fields = importFields[kind];
  const read = headers.map((header) => readHeader(header));
  const columns: ColumnMapping = {};
  const source: Record<string, 'saved' | 'detected'> = {};
  const taken = new Set<number>();

  for (const field of fields) {
    const saved = remembered?.[field.key];
    if (!saved) continue;
    const wanted = matchingName(saved.header);
    const column = read.findIndex((header, index) => !taken.has(index) && matchingName(header.text) === wanted);
    if (column < 0) continue;
    columns[field.key] = choiceFor(field, read[column], column, saved.unit);
    source[field.key] = 'saved';
    taken.add(column);
  }

  read.forEach((header, column) => {
    if (taken.has(column) || header.text === '') return;
    const field = bestField(fields, header, columns) ?? errorAfterValue(fields, read, column, columns, taken);
    if (!field) return;
    columns[field.key] = choiceFor(field, header, column, field.errorOf ? columns[field.errorOf]?.unit : undefined);
    source[field.key] = 'detected';
    taken.add(column);
  });
  return { columns, source };
}

function bestField(fields: readonly ImportField[], header: ReadHeader, columns: ColumnMapping): ImportField | undefined {
  const candidates = fields.filter((field) => columns[field.key] === undefined && field.aliases.includes(header.name));
  if (candidates.length <= 1) return candidates[0];
  if (header.unit === null) return candidates.find((field) => field.unitKind === undefined) ?? candidates[0];
  const unit = header.unit;
  return (
    candidates.find((field) => field.unitKind !== undefined && canonicalUnit(unit, field.unitKind) !== undefined) ??
    candidates.find((field) => field.unitKind !== undefined) ??
    candidates[0]
  );
}

function errorAfterValue(
  fields: readonly ImportField[],
  read: readonly ReadHeader[],
  column: number,
  columns: ColumnMapping,
  taken: ReadonlySet<number>,
): ImportField | undefined {
  if (!BARE_ERROR_NAMES.has(read[column].name) || column === 0 || !taken.has(column - 1)) return undefined;
  const valueField = fields.find((field) => columns[field.key]?.column === column - 1);
  if (!valueField) return undefined;
  return fields.find((field) => field.errorOf === valueField.key && columns[field.key] === undefined);
}

function choiceFor(field: ImportField, header: ReadHeader, column: number, fallbackUnit: string | undefined): ColumnMapping[string] {
  if (field.unitKind === undefined) return { column };
  const written = header.unit === null ? undefined : canonicalUnit(header.unit, field.unitKind);
  const unit = written ?? (header.unit === null ? fallbackUnit : undefined);
  return unit === undefined ? { column } : { column, unit };
}
