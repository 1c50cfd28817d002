import type { DataSource } from 'typeorm';
import { maxImportRows } from '@shared/schemas/import';
import { maxVariantPageSize, type ListVariantsQuery } from '@shared/schemas/variant';
import { badRequest } from '../../http/errors';
import { queryByIds } from '../imports/import-lookups';
import { listVariants } from '../variants/list-variants';
import type { OutputCell, OutputSheet } from './spreadsheet-writer';

/**
 * Column headers of the variant export. The first six are the columns a variants import reads, spelt so
 * that the import detects them; the rest are the registry's summary numbers in the stored units.
 */
export const variantExportHeaders = [
  'Campaign',
  'Mutations',
  'Status',
  'Construct id',
  'Notes',
  'Lineage parent',
  'HGVS',
  'Positions',
  'Catalytic roles',
  'kcat (s⁻¹)',
  'Km (M)',
  'kcat/Km (M⁻¹ s⁻¹)',
  'Fold change (kcat/Km over parent)',
  'ΔΔG‡ (kJ/mol)',
  'ΔΔG‡ SE (kJ/mol)',
  'pH optimum',
  'Measurements',
  'STRENDA completeness',
  'Flags',
  'Updated',
] as const;

/**
 * The registry's current view as a table: the rows `GET /api/variants` returns for the same filters and
 * sort, every page of them (the query's page and page size are ignored), with the notes, lineage parent and
 * campaign name the list leaves out. At most 200,000 rows, the import's limit, so every export re-imports.
 *
 * @param dataSource the data source
 * @param query the parsed list query
 * @throws {HttpError} 400 when the view has more rows than an export takes
 * @returns the sheet
 */
export async function variantExportSheet(dataSource: DataSource, query: ListVariantsQuery): Promise<OutputSheet> {
  const first = await listVariants(dataSource, { ...query, page: 1, pageSize: maxVariantPageSize });
  if (first.total > maxImportRows) {
    const message = `the view has ${first.total} variants; an export takes at most ${maxImportRows}; narrow the filters`;
    throw badRequest(`The export cannot be made: ${message}.`, { view: message });
  }
  const rows: OutputCell[][] = [];
  const pages = Math.ceil(first.total / maxVariantPageSize);
  for (let page = 1; page <= pages; page += 1) {
    const list = page === 1 ? first : await listVariants(dataSource, { ...query, page, pageSize: maxVariantPageSize });
    const ids = list.rows.map((row) => row.id);
    const details = new Map(
      (
        await queryByIds<{ id: number; notes: string | null; campaign_name: string; parent_label: string | null }>(
          dataSource.manager,
          ids,
          `SELECT v.id, v.notes, c.name AS campaign_name, p.label AS parent_label
             FROM variants v JOIN campaigns c ON c.id = v.campaign_id LEFT JOIN variants p ON p.id = v.parent_variant_id
            WHERE v.id IN (?)`,
        )
      ).map((detail) => [detail.id, detail]),
    );
    for (const row of list.rows) {
      const detail = details.get(row.id);
      rows.push([
        detail?.campaign_name ?? null,
        row.label,
        row.status,
        row.constructId,
        detail?.notes ?? null,
        detail?.parent_label ?? null,
        row.hgvs,
        row.positions.join(', ') || null,
        row.roles.join(', ') || null,
        row.kcat?.value ?? null,
        row.km?.value ?? null,
        row.kcatOverKm?.value ?? null,
        row.foldChange,
        row.ddg?.value ?? null,
        row.ddg?.se ?? null,
        row.phOptimum,
        row.measurementCount,
        row.completeness,
        row.flags.join(', ') || null,
        new Date(row.updatedAt),
      ]);
    }
  }
  return { name: 'Variants', headers: variantExportHeaders, rows };
}
