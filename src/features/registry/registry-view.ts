/**
 * The registry's whole view (filters, sort, visible columns) as URL search parameters, so that a link
 * reproduces the view and the browser's back and forward buttons step through earlier views. The
 * filter and sort parameters carry the names and units of `GET /api/variants` (ΔΔG‡ bounds in kJ/mol
 * whatever unit the reader prefers), and they are read with the API's own schema.
 */
import type { CatalyticRole } from '@shared/schemas/enzyme';
import { listVariantsQuery, type VariantSortKey, type VariantStatus } from '@shared/schemas/variant';

export interface RegistryFilters {
  campaignId?: number;
  position?: number;
  /** One-letter code. */
  residue?: string;
  role?: CatalyticRole;
  status?: VariantStatus[];
  minFoldChange?: number;
  ddgMinKJPerMol?: number;
  ddgMaxKJPerMol?: number;
  q?: string;
}

export type SortOrder = 'asc' | 'desc';

export interface RegistrySort {
  key: VariantSortKey;
  order: SortOrder;
}

/** Grid columns, in display order. */
// What the variant is, then the ranking numbers (ΔΔG‡ and fold change), then the kinetics behind them.
export const registryColumnIds = [
  'label',
  'hgvs',
  'positions',
  'roles',
  'status',
  'ddg',
  'foldChange',
  'kcat',
  'km',
  'kcatOverKm',
  'phOptimum',
  'measurementCount',
  'completeness',
  'flags',
  'updated',
] as const;
export type RegistryColumnId = (typeof registryColumnIds)[number];

/** The label is what links a row to its variant, so it cannot be hidden. */
export const alwaysVisibleColumn: RegistryColumnId = 'label';

/** HGVS repeats the label in a longer notation; it is there for those who want it. */
export const defaultVisibleColumns: readonly RegistryColumnId[] = registryColumnIds.filter((id) => id !== 'hgvs');

/** Rows per grid block, and so per request of the list API: the first screenful and a few screens more. */
export const registryBlockSize = 100;

/** The list API's own default: most recently changed first. */
export const defaultSort: RegistrySort = { key: 'updated', order: 'desc' };

export interface RegistryView {
  filters: RegistryFilters;
  sort: RegistrySort;
  /** Visible columns in display order. */
  columns: RegistryColumnId[];
}

export interface ParsedRegistryView {
  view: RegistryView;
  /** One message per parameter that could not be read and was left out. */
  ignored: string[];
}

// URL parameter → filter field; the URL uses the list API's names.
const filterParameters = {
  campaignId: 'campaignId',
  position: 'position',
  residue: 'residue',
  role: 'role',
  status: 'status',
  minFoldChange: 'minFoldChange',
  ddgMin: 'ddgMinKJPerMol',
  ddgMax: 'ddgMaxKJPerMol',
  q: 'q',
} as const satisfies Record<string, keyof RegistryFilters>;
type FilterParameter = keyof typeof filterParameters;

const viewParameters = [...Object.keys(filterParameters), 'sort', 'order'] as const;
const COLUMNS_PARAMETER = 'columns';
// A few rounds suffice: each round drops at least one bad parameter.
const MAX_PARSE_ROUNDS = viewParameters.length + 1;

/** Reads a view from search parameters; unreadable parameters are dropped and reported, never fatal. */
export function parseRegistryView(search: URLSearchParams): ParsedRegistryView {
  const ignored: string[] = [];
  const raw: Record<string, string> = {};
  for (const name of viewParameters) {
    const values = search.getAll(name);
    if (values.length > 0) raw[name] = values.join(',');
  }

  let parsed = listVariantsQuery.safeParse(raw);
  for (let round = 0; !parsed.success && round < MAX_PARSE_ROUNDS; round += 1) {
    for (const issue of parsed.error.issues) {
      const name = String(issue.path[0] ?? '');
      if (name in raw) {
        ignored.push(`${name}=${raw[name]}: ${issue.message}`);
        delete raw[name];
      }
    }
    parsed = listVariantsQuery.safeParse(raw);
  }
  const query = parsed.success ? parsed.data : listVariantsQuery.parse({});

  const filters: RegistryFilters = {};
  for (const [parameter, field] of Object.entries(filterParameters) as [FilterParameter, keyof RegistryFilters][]) {
    const value = query[parameter];
    if (value !== undefined) Object.assign(filters, { [field]: value });
  }

  return {
    view: { filters, sort: { key: query.sort, order: query.order }, columns: parseColumns(search.get(COLUMNS_PARAMETER), ignored) },
    ignored,
  };
}

function parseColumns(text: string | null, ignored: string[]): RegistryColumnId[] {
  if (text === null) return [...defaultVisibleColumns];
  const named = text.split(',').map((part) => part.trim()).filter((part) => part !== '');
  const unknown = named.filter((name) => !(registryColumnIds as readonly string[]).includes(name));
  if (unknown.length > 0) ignored.push(`columns: ${unknown.map((name) => `'${name}'`).join(', ')} ${unknown.length === 1 ? 'is not a column' : 'are not columns'}`);
  const wanted = new Set([alwaysVisibleColumn, ...named]);
  return registryColumnIds.filter((id) => wanted.has(id));
}

// Stored ΔΔG‡ bounds come from a unit conversion; six significant figures keep the URL short and exact enough.
const compactNumber = (value: number) => String(Number(value.toPrecision(6)));

// Filters as the list API's parameters, in a fixed order.
function filterEntries(filters: RegistryFilters): [string, string][] {
  const entries: [string, string][] = [];
  if (filters.campaignId !== undefined) entries.push(['campaignId', String(filters.campaignId)]);
  if (filters.position !== undefined) entries.push(['position', String(filters.position)]);
  if (filters.residue !== undefined) entries.push(['residue', filters.residue]);
  if (filters.role !== undefined) entries.push(['role', filters.role]);
  if (filters.status !== undefined && filters.status.length > 0) entries.push(['status', filters.status.join(',')]);
  if (filters.minFoldChange !== undefined) entries.push(['minFoldChange', compactNumber(filters.minFoldChange)]);
  if (filters.ddgMinKJPerMol !== undefined) entries.push(['ddgMin', compactNumber(filters.ddgMinKJPerMol)]);
  if (filters.ddgMaxKJPerMol !== undefined) entries.push(['ddgMax', compactNumber(filters.ddgMaxKJPerMol)]);
  if (filters.q !== undefined && filters.q !== '') entries.push(['q', filters.q]);
  return entries;
}

/** The canonical search string of a view: fixed parameter order, defaults left out. */
export function registryViewSearch(view: RegistryView): string {
  const search = new URLSearchParams(filterEntries(view.filters));
  if (view.sort.key !== defaultSort.key || view.sort.order !== defaultSort.order) {
    search.set('sort', view.sort.key);
    search.set('order', view.sort.order);
  }
  const sameAsDefault =
    view.columns.length === defaultVisibleColumns.length && view.columns.every((id, index) => id === defaultVisibleColumns[index]);
  if (!sameAsDefault) search.set(COLUMNS_PARAMETER, view.columns.join(','));
  return search.toString();
}

/** The filters and sort of a view as `GET /api/variants` parameters, without a page: what an export of the view takes. */
export function variantListQuery(filters: RegistryFilters, sort: RegistrySort): Record<string, string> {
  return { ...Object.fromEntries(filterEntries(filters)), sort: sort.key, order: sort.order };
}

/** Query parameters of one page of `GET /api/variants` for a view. */
export function variantListParams(filters: RegistryFilters, sort: RegistrySort, page: number, pageSize: number): Record<string, string> {
  return { ...variantListQuery(filters, sort), page: String(page), pageSize: String(pageSize) };
}

/** Whether any filter is set. */
export function hasFilters(filters: RegistryFilters): boolean {
  return Object.values(filters).some((value) => value !== undefined && !(Array.isArray(value) && value.length === 0));
}
