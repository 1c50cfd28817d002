import type { ColDef } from 'ag-grid-community';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { VariantListRowDto, VariantSortKey } from '@shared/schemas/variant';
import { formatDate, formatEnergy, formatFoldChange, formatKcatOverKm, formatKm, formatNumber, formatPh } from '@/lib/format';
import { registryColumnIds, type RegistryColumnId, type RegistryView } from '../registry-view';
import { columnTitles } from './column-titles';
import { FlagsCell, LabelCell, RolesCell, StatusCell, type RoleStyles } from './variant-cells';

// Types only from the grid package: the first rows are drawn from these definitions before the grid's code has loaded.

type Row = VariantListRowDto;

/** Grid columns that the server can sort by, and the list API's key for each. */
export const sortKeyOfColumn: Partial<Record<RegistryColumnId, VariantSortKey>> = {
  label: 'label',
  positions: 'position',
  kcat: 'kcat',
  km: 'km',
  kcatOverKm: 'kcatOverKm',
  foldChange: 'foldChange',
  ddg: 'ddg',
  updated: 'updated',
};
export const columnOfSortKey = Object.fromEntries(Object.entries(sortKeyOfColumn).map(([column, key]) => [key, column])) as Record<
  VariantSortKey,
  RegistryColumnId
>;

// Larger-is-better quantities sort descending on the first click; energies, labels and positions ascending.
const descendingFirst: readonly RegistryColumnId[] = ['kcat', 'kcatOverKm', 'foldChange', 'updated'];

// The trade writes the unit once, in the header, for quantities with a fixed unit.
const withoutUnit = (text: string, unit: string) => (text.endsWith(` ${unit}`) ? text.slice(0, -unit.length - 1) : text);

/** The registry's columns, for the grid and for the first rows drawn before it. */
export function columnDefinitions(energyUnit: EnergyUnit, roleStyles: RoleStyles, initial: RegistryView): ColDef<Row>[] {
  // The right-aligned type's own cell class is replaced by ours, so ours aligns the figures too.
  const numeric = { type: 'rightAligned', cellClass: 'numeric font-mono text-[13px]' } as const;
  const specs: Record<RegistryColumnId, ColDef<Row>> = {
    label: { headerName: columnTitles.label, cellRenderer: LabelCell, pinned: 'left', initialWidth: 170, lockVisible: true },
    hgvs: { headerName: columnTitles.hgvs, valueGetter: ({ data }) => data?.hgvs, cellClass: 'font-mono text-[13px]', initialWidth: 230 },
    positions: { headerName: columnTitles.positions, valueGetter: ({ data }) => data?.positions.join(', '), ...numeric, initialWidth: 130 },
    roles: { headerName: columnTitles.roles, cellRenderer: RolesCell, cellRendererParams: { roleStyles }, initialWidth: 300 },
    status: { headerName: columnTitles.status, cellRenderer: StatusCell, initialWidth: 175 },
    kcat: { headerName: 'kcat (s⁻¹)', valueGetter: ({ data }) => data && formatNumber(data.kcat?.value), ...numeric, initialWidth: 110 },
    km: { headerName: columnTitles.km, valueGetter: ({ data }) => data && formatKm(data.km?.value), ...numeric, initialWidth: 110 },
    kcatOverKm: {
      headerName: 'kcat/Km (M⁻¹ s⁻¹)',
      valueGetter: ({ data }) => data && withoutUnit(formatKcatOverKm(data.kcatOverKm?.value), 'M⁻¹ s⁻¹'),
      ...numeric,
      initialWidth: 160,
    },
    foldChange: {
      headerName: 'Fold change (kcat/Km)',
      valueGetter: ({ data }) => data && formatFoldChange(data.foldChange),
      ...numeric,
      initialWidth: 190,
    },
    ddg: {
      headerName: `ΔΔG‡ ± SE (${energyUnit})`,
      valueGetter: ({ data }) => data && withoutUnit(formatEnergy(data.ddg?.value, data.ddg?.se, energyUnit), energyUnit),
      ...numeric,
      initialWidth: 180,
    },
    phOptimum: { headerName: columnTitles.phOptimum, valueGetter: ({ data }) => data && formatPh(data.phOptimum), ...numeric, initialWidth: 110 },
    measurementCount: { headerName: 'n', valueGetter: ({ data }) => data?.measurementCount, ...numeric, initialWidth: 64 },
    completeness: {
      headerName: 'Reporting',
      valueGetter: ({ data }) => data && (data.completeness === null ? '—' : `${Math.round(data.completeness * 100)} %`),
      ...numeric,
      initialWidth: 110,
    },
    flags: { headerName: columnTitles.flags, cellRenderer: FlagsCell, initialWidth: 200 },
    updated: { headerName: columnTitles.updated, valueGetter: ({ data }) => data && formatDate(data.updatedAt), initialWidth: 130 },
  };
  const visible = new Set(initial.columns);
  return registryColumnIds.map((id) => {
    const sortKey = sortKeyOfColumn[id];
    return {
      ...specs[id],
      colId: id,
      sortable: sortKey !== undefined,
      // No unsorted state: the list always has an order, and the header always shows which.
      sortingOrder: descendingFirst.includes(id) ? ['desc', 'asc'] : ['asc', 'desc'],
      initialSort: sortKey !== undefined && sortKey === initial.sort.key ? initial.sort.order : undefined,
      initialHide: !visible.has(id),
    };
  });
}
