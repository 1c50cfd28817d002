import type { ImportKind } from '@shared/schemas/import';

/** The query of the variant list, as the registry keeps it (strings) or as the list API types it. */
export type VariantListQuery = Readonly<Record<string, string | number | readonly string[] | undefined | null>>;

/**
 * The download address of the registry's current view: the same query as `GET /api/variants` (the server
 * ignores the page), so the file holds exactly the rows the grid shows, in its order.
 *
 * @param query the list query
 * @param format xlsx or csv
 * @returns the address, under /api
 */
export function variantExportUrl(query: VariantListQuery, format: 'xlsx' | 'csv'): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, Array.isArray(value) ? value.join(',') : String(value));
  }
  const text = search.toString();
  return `/api/exports/variants.${format}${text ? `?${text}` : ''}`;
}

/**
 * The download address of a campaign's measurements: a workbook with sheets of measurements, rate points and
 * conditions, or one of those as CSV.
 */
export function campaignMeasurementsExportUrl(campaignId: number, format: 'xlsx' | 'csv', sheet: 'measurements' | 'rate-points' | 'conditions' = 'measurements'): string {
  return `/api/exports/campaigns/${campaignId}/measurements.${format}${format === 'csv' ? `?sheet=${sheet}` : ''}`;
}

/** The blank template of an import kind. */
export function importTemplateUrl(kind: ImportKind): string {
  return `/api/imports/templates/${kind}.xlsx`;
}
