import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxVariantPageSize, type VariantListDto, type VariantListRowDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';
import { filtersToListParams, type LandscapeFilters } from '../lib/landscape-filters';

/** Most variants the scatter plots draw: ten pages of the list, the best by kcat/Km first. */
export const maxLandscapeVariants = 10 * maxVariantPageSize;

export interface LandscapeVariants {
  rows: VariantListRowDto[];
  /** How many variants match the filters in all. */
  total: number;
  /** True when more matched than were fetched. */
  truncated: boolean;
}

/**
 * The filtered variants with their summary kinetics, best kcat/Km first (unmeasured ones come last in the
 * API's order, so paging stops when they start).
 */
export async function getLandscapeVariants(filters: LandscapeFilters): Promise<LandscapeVariants> {
  const rows: VariantListRowDto[] = [];
  let total = 0;
  for (let page = 1; rows.length < maxLandscapeVariants; page += 1) {
    const search = new URLSearchParams();
    for (const [key, value] of Object.entries({ ...filtersToListParams(filters), sort: 'kcatOverKm', order: 'desc', page, pageSize: maxVariantPageSize })) {
      if (value !== undefined && value !== '') search.set(key, String(value));
    }
    const result = await api.get<VariantListDto>(`/variants?${search.toString()}`);
    total = result.total;
    rows.push(...result.rows);
    const reachedUnmeasured = result.rows.some((row) => row.kcatOverKm === null);
    if (result.rows.length < maxVariantPageSize || reachedUnmeasured || rows.length >= total) break;
  }
  return { rows, total, truncated: rows.length < total && rows[rows.length - 1]?.kcatOverKm !== null };
}

export const getLandscapeVariantsQueryOptions = (filters: LandscapeFilters) =>
  queryOptions({ queryKey: ['variants', 'landscape', filters], queryFn: () => getLandscapeVariants(filters) });

/** `enabled` lets the page hold this heavy list back until its first chart is drawn. */
export const useLandscapeVariants = (filters: LandscapeFilters, enabled = true) =>
  useQuery({ ...getLandscapeVariantsQueryOptions(filters), enabled: enabled && filters.campaignId !== undefined });
