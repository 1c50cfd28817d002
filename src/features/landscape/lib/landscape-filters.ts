import type { CampaignLandscapeDto, LandscapeCellDto } from '@shared/schemas/comparison';
import { listVariantsQuery, type ListVariantsParams, type VariantStatus } from '@shared/schemas/variant';

/** The filters the landscape shares with the registry, under the same names as GET /api/variants. */
export const landscapeFilterNames = ['campaignId', 'status', 'role', 'minFoldChange', 'position', 'residue', 'ddgMin', 'ddgMax', 'q'] as const;
export type LandscapeFilterName = (typeof landscapeFilterNames)[number];

export interface LandscapeFilters {
  campaignId?: number;
  status?: VariantStatus[];
  role?: string;
  minFoldChange?: number;
  position?: number;
  residue?: string;
  ddgMin?: number;
  ddgMax?: number;
  q?: string;
}

/**
 * Reads the filters from the page's query string with the list API's own schema, so a link copied from the
 * registry means the same here. Parameters the landscape does not use (sort, page) are ignored; a bad value
 * is dropped and reported.
 *
 * @param params the query string
 * @returns the filters and the problems, `name: message`
 */
export function readLandscapeFilters(params: URLSearchParams): { filters: LandscapeFilters; problems: string[] } {
  const raw: Record<string, string> = {};
  for (const name of landscapeFilterNames) {
    const value = params.get(name);
    if (value !== null && value.trim() !== '') raw[name] = value;
  }
  const result = listVariantsQuery.safeParse(raw);
  if (result.success) return { filters: pick(result.data), problems: [] };
  const problems: string[] = [];
  const bad = new Set<string>();
  for (const issue of result.error.issues) {
    const name = String(issue.path[0] ?? '');
    bad.add(name);
    problems.push(`${name}: ${issue.message}`);
  }
  // Keep what is valid: parse again without the refused parameters.
  const kept = Object.fromEntries(Object.entries(raw).filter(([name]) => !bad.has(name)));
  const retry = listVariantsQuery.safeParse(kept);
  return { filters: retry.success ? pick(retry.data) : {}, problems };
}

function pick(query: ReturnType<typeof listVariantsQuery.parse>): LandscapeFilters {
  const filters: LandscapeFilters = {};
  if (query.campaignId !== undefined) filters.campaignId = query.campaignId;
  if (query.status !== undefined) filters.status = query.status;
  if (query.role !== undefined) filters.role = query.role;
  if (query.minFoldChange !== undefined) filters.minFoldChange = query.minFoldChange;
  if (query.position !== undefined) filters.position = query.position;
  if (query.residue !== undefined) filters.residue = query.residue;
  if (query.ddgMin !== undefined) filters.ddgMin = query.ddgMin;
  if (query.ddgMax !== undefined) filters.ddgMax = query.ddgMax;
  if (query.q !== undefined) filters.q = query.q;
  return filters;
}

/** The filters as a query string (statuses comma-separated, as the registry writes them). */
export function filtersToSearch(filters: LandscapeFilters): string {
  const search = new URLSearchParams();
  for (const name of landscapeFilterNames) {
    const value = filters[name];
    if (value === undefined || (Array.isArray(value) && value.length === 0)) continue;
    search.set(name, Array.isArray(value) ? value.join(',') : String(value));
  }
  return search.toString();
}

/** Whether any filter beyond the campaign is set. */
export function hasVariantFilters(filters: LandscapeFilters): boolean {
  return landscapeFilterNames.some((name) => name !== 'campaignId' && filters[name] !== undefined);
}

/** The list API's parameters for the filtered variants. */
export function filtersToListParams(filters: LandscapeFilters): ListVariantsParams {
  return { ...filters, status: filters.status?.join(',') } as ListVariantsParams;
}

/**
 * The landscape's cells that pass the filters, applied here as the list API applies them to a
 * single-substitution variant: status among those chosen, the catalytic role annotated at its position,
 * its position, the parent or new residue, fold change at least the minimum, ΔΔG‡ (kJ/mol) within the
 * bounds. The text search `q` looks at the label only (the API also searches HGVS, construct id and notes).
 *
 * @param landscape the campaign's landscape
 * @param filters the filters
 * @returns the cells kept
 */
export function filterCells(landscape: CampaignLandscapeDto, filters: LandscapeFilters): LandscapeCellDto[] {
  const rolesAt = new Map(landscape.positions.map((position) => [position.position, position.catalyticRoles]));
  const q = filters.q?.toLowerCase();
  return landscape.cells.filter((cell) => {
    if (filters.status && !filters.status.includes(cell.status as VariantStatus)) return false;
    if (filters.role && !(rolesAt.get(cell.position) ?? []).includes(filters.role)) return false;
    if (filters.position !== undefined && cell.position !== filters.position) return false;
    if (filters.residue && cell.from !== filters.residue && cell.to !== filters.residue) return false;
    if (filters.minFoldChange !== undefined && !(cell.foldChange !== null && cell.foldChange >= filters.minFoldChange)) return false;
    if (filters.ddgMin !== undefined && !(cell.ddgKjPerMol !== null && cell.ddgKjPerMol >= filters.ddgMin)) return false;
    if (filters.ddgMax !== undefined && !(cell.ddgKjPerMol !== null && cell.ddgKjPerMol <= filters.ddgMax)) return false;
    if (q && !cell.label.toLowerCase().includes(q)) return false;
    return true;
  });
}
