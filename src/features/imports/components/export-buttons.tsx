import { variantExportUrl, type VariantListQuery } from '../api/export-urls';

const linkClass =
  'inline-flex items-center gap-1.5 rounded-md border border-paper-300 bg-white px-3 py-1.5 text-sm font-semibold text-ink-900 hover:bg-paper-100';

/**
 * Downloads of the registry's current view as .xlsx and .csv: the same filters and sort as the list
 * query given (the page is ignored; every matching row is exported).
 */
export function ExportButtons({ query }: { query: VariantListQuery }) {
  return (
    <div className="flex gap-2" role="group" aria-label="Export the rows shown">
      <a href={variantExportUrl(query, 'xlsx')} download className={linkClass}>
        <span aria-hidden>⤓</span> Excel (.xlsx)
      </a>
      <a href={variantExportUrl(query, 'csv')} download className={linkClass}>
        <span aria-hidden>⤓</span> CSV
      </a>
    </div>
  );
}
