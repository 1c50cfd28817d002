import { readHeader } from '@shared/imports/read-header';
import { canonicalUnit, unitsOfKind } from '@shared/imports/unit-spelling';
import { importFields, importKindLabels, type ColumnMapping, type ImportField, type ImportKind } from '@shared/schemas/import';
import { badRequest } from '../../http/errors';

/** A field with the column it is read from and, for a quantity, the column's unit in the API's spelling. */
export interface ResolvedColumn {
  field: ImportField;
  column: number;
  header: string;
  unit?: string;
}

/** Field key → its column; fields not in the map are not imported. */
export type ResolvedMapping = ReadonlyMap<string, ResolvedColumn>;

const UNIT_EXAMPLES: Record<string, string> = {
  concentration: 'Km (mM)',
  turnover: 'kcat (1/s)',
  rate: 'v0 (µM/min)',
  specificity: 'kcat/Km (M-1 s-1)',
  temperature: 'Temperature (°C)',
  phRate: 'kcat/Km (M-1 s-1)',
};

/**
 * Checks a column mapping against the sheet's header row and settles each quantity's unit: the unit
 * chosen in the mapping or, when none is chosen, the one written in the header (`Km (mM)`). A standard
 * error takes the unit of its value and must agree with it; the two ends of a substrate range share one
 * unit. Every problem is a 400 on `columns.<field>` (or `campaignId`), all found at once.
 *
 * @param kind the import kind
 * @param headers the sheet's header row
 * @param columns field key → column and unit, as sent
 * @param hasDefaultCampaign whether the mapping names a campaign for every row
 * @throws {HttpError} 400 naming each bad field
 * @returns the resolved mapping
 */
export function resolveMapping(kind: ImportKind, headers: readonly string[], columns: ColumnMapping, hasDefaultCampaign: boolean): ResolvedMapping {
  const fields = importFields[kind];
  const problems: Record<string, string> = {};
  const resolved = new Map<string, ResolvedColumn>();
  const byColumn = new Map<number, string>();

  for (const [key, choice] of Object.entries(columns)) {
    if (choice === null) continue;
    const field = fields.find((candidate) => candidate.key === key);
    if (!field) {
      problems[`columns.${key}`] = `is not a field of a ${importKindLabels[kind].toLowerCase()} import`;
      continue;
    }
    if (choice.column >= headers.length) {
      problems[`columns.${key}`] = `column ${choice.column + 1} is beyond the sheet's last column (${headers.length})`;
      continue;
    }
    const other = byColumn.get(choice.column);
    if (other !== undefined) {
      problems[`columns.${key}`] = `column ${headers[choice.column] || choice.column + 1} is already mapped to ${labelOf(fields, other)}`;
      continue;
    }
    byColumn.set(choice.column, key);
    const header = headers[choice.column] ?? '';
    const unit = field.unitKind === undefined ? undefined : settleUnit(field, header, choice.unit, problems);
    resolved.set(key, { field, column: choice.column, header, unit });
  }

  for (const field of fields) {
    if (!field.required || resolved.has(field.key) || problems[`columns.${field.key}`]) continue;
    if (field.key === 'campaign' && hasDefaultCampaign) continue;
    problems[`columns.${field.key}`] = `is required: choose the column that holds ${field.label}${field.key === 'campaign' ? ', or a campaign for the whole file' : ''}`;
  }

  for (const column of resolved.values()) {
    const valueKey = column.field.errorOf;
    if (valueKey === undefined) continue;
    const value = resolved.get(valueKey);
    if (!value) {
      problems[`columns.${column.field.key}`] = `is mapped without ${labelOf(fields, valueKey)}`;
      continue;
    }
    if (column.unit !== undefined && value.unit !== undefined && column.unit !== value.unit) {
      problems[`columns.${column.field.key}`] = `mixed units: ${value.field.label} is in ${value.unit} but its SE in ${column.unit}; give both in one unit`;
    }
  }
  const low = resolved.get('substrateMin');
  const high = resolved.get('substrateMax');
  if (low?.unit !== undefined && high?.unit !== undefined && low.unit !== high.unit) {
    problems['columns.substrateMax'] = `mixed units: the lowest substrate concentration is in ${low.unit} but the highest in ${high.unit}; give both in one unit`;
  }

  if (Object.keys(problems).length > 0) {
    const summary = Object.entries(problems)
      .slice(0, 3)
      .map(([key, message]) => `${labelOf(fields, key.replace(/^columns\./, ''))} ${message}`)
      .join('; ');
    throw badRequest(`The column mapping cannot be used: ${summary}.`, problems);
  }
  return resolved;
}

function settleUnit(field: ImportField, header: string, chosen: string | undefined, problems: Record<string, string>): string | undefined {
  const kind = field.unitKind!;
  const key = `columns.${field.key}`;
  const written = readHeader(header).unit;
  const fromHeader = written === null ? undefined : canonicalUnit(written, kind);
  if (chosen !== undefined && chosen !== '') {
    const unit = canonicalUnit(chosen, kind);
    if (unit === undefined) {
      problems[key] = `unit ${chosen} is not one of ${unitsOfKind[kind].join(', ')}`;
      return undefined;
    }
    if (fromHeader !== undefined && fromHeader !== unit) {
      problems[key] = `mixed units: the header says ${fromHeader} but ${unit} was chosen; choose ${fromHeader} or correct the header`;
      return undefined;
    }
    return unit;
  }
  if (fromHeader !== undefined) return fromHeader;
  // A standard error without its own unit takes its value's, settled by the caller.
  if (field.errorOf !== undefined && written === null) return undefined;
  problems[key] =
    written === null
      ? `needs a unit: write it in the header, e.g. ${UNIT_EXAMPLES[kind]}, or choose one`
      : `the header's unit ${written} is not one Kcatalog converts (${unitsOfKind[kind].join(', ')}); choose the unit`;
  return undefined;
}

function labelOf(fields: readonly ImportField[], key: string): string {
  return fields.find((field) => field.key === key)?.label ?? key;
}

/**
 * The unit a field is read in: its own, or for a standard error without one, its value's.
 *
 * @param mapping the resolved mapping
 * @param key the field
 * @returns the unit in the API's spelling, if the field has one
 */
export function unitOf(mapping: ResolvedMapping, key: string): string | undefined {
  const column = mapping.get(key);
  if (!column) return undefined;
  if (column.unit !== undefined) return column.unit;
  return column.field.errorOf === undefined ? undefined : mapping.get(column.field.errorOf)?.unit;
}

/**
 * The mapping in the form it is remembered for the user: field key → header text and unit.
 *
 * @param mapping the resolved mapping
 * @returns the remembered form
 */
export function rememberedForm(mapping: ResolvedMapping): Record<string, { header: string; unit?: string }> {
  const remembered: Record<string, { header: string; unit?: string }> = {};
  for (const [key, column] of mapping) {
    if (column.header === '') continue;
    remembered[key] = column.unit === undefined ? { header: column.header } : { header: column.header, unit: column.unit };
  }
  return remembered;
}
