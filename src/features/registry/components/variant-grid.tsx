import { useQueryClient } from '@tanstack/react-query';
import {
  CellStyleModule,
  ColumnApiModule,
  InfiniteRowModelModule,
  ModuleRegistry,
  type CellKeyDownEvent,
  type ColDef,
  type GridApi,
  type GridReadyEvent,
  type IDatasource,
  type SortChangedEvent,
  type SortDirection,
  type SortModelItem,
} from 'ag-grid-community';
import { AgGridReact } from 'ag-grid-react';
import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { VariantListRowDto, VariantSortKey } from '@shared/schemas/variant';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { formatDate, formatEnergy, formatFoldChange, formatKcatOverKm, formatKm, formatNumber, formatPh } from '@/lib/format';
import { getVariantPageQueryOptions } from '../api/get-variant-page';
import {
  alwaysVisibleColumn,
  defaultSort,
  hasFilters,
  registryBlockSize,
  registryColumnIds,
  variantListParams,
  type RegistryColumnId,
  type RegistryFilters,
  type RegistrySort,
  type RegistryView,
} from '../registry-view';
import { columnTitles } from './column-titles';
import { registryGridTheme } from './grid-theme';
import { FlagsCell, LabelCell, RolesCell, StatusCell, type RoleStyles } from './variant-cells';

// Only what the grid uses beyond the core (which brings sorting, pinning, resizing and loading skeletons):
// the infinite row model, cell classes, and the column-state calls that keep the grid and the URL in step.
ModuleRegistry.registerModules([InfiniteRowModelModule, CellStyleModule, ColumnApiModule]);

type Row = VariantListRowDto;

/** Rows drawn beyond the visible ones, above and below. */
const ROW_BUFFER = 4;
/** Blocks kept in memory (2,000 rows); older ones are fetched again when scrolled back to. */
const MAX_BLOCKS_IN_CACHE = 20;

/** Grid columns that the server can sort by, and the list API's key for each. */
const sortKeyOfColumn: Partial<Record<RegistryColumnId, VariantSortKey>> = {
  label: 'label',
  positions: 'position',
  kcat: 'kcat',
  km: 'km',
  kcatOverKm: 'kcatOverKm',
  foldChange: 'foldChange',
  ddg: 'ddg',
  updated: 'updated',
};
const columnOfSortKey = Object.fromEntries(Object.entries(sortKeyOfColumn).map(([column, key]) => [key, column])) as Record<
  VariantSortKey,
  RegistryColumnId
>;

// Larger-is-better quantities sort descending on the first click; energies, labels and positions ascending.
const descendingFirst: readonly RegistryColumnId[] = ['kcat', 'kcatOverKm', 'foldChange', 'updated'];

// The trade writes the unit once, in the header, for quantities with a fixed unit.
const withoutUnit = (text: string, unit: string) => (text.endsWith(` ${unit}`) ? text.slice(0, -unit.length - 1) : text);


function columnDefinitions(energyUnit: EnergyUnit, roleStyles: RoleStyles, initial: RegistryView): ColDef<Row>[] {
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

function sortFromModel(model: readonly SortModelItem[]): RegistrySort {
  const first = model[0];
  const key = first ? sortKeyOfColumn[first.colId as RegistryColumnId] : undefined;
  return key === undefined || !first ? defaultSort : { key, order: first.sort === 'desc' ? 'desc' : 'asc' };
}

function gridSort(api: GridApi<Row>): RegistrySort {
  const sorted = api.getColumnState().find((state) => state.sort === 'asc' || state.sort === 'desc');
  return sorted ? sortFromModel([{ colId: sorted.colId, sort: sorted.sort as NonNullable<SortDirection> }]) : defaultSort;
}

// Grid options passed as props must keep their identity between renders, or the grid re-applies them.
const defaultColDef: ColDef<Row> = { resizable: true, suppressMovable: true, cellDataType: false };
const rowId = ({ data }: { data: Row }) => String(data.id);

type LoadState = { kind: 'loading' } | { kind: 'loaded'; total: number } | { kind: 'failed'; error: unknown };

export interface VariantGridProps {
  view: RegistryView;
  energyUnit: EnergyUnit;
  roleStyles: RoleStyles;
  /** The reader sorted by a column header. */
  onSortChange: (sort: RegistrySort) => void;
  /** Controls shown on the line above the grid, beside the row count. */
  toolbar?: ReactNode;
}

/**
 * The registry grid: AG Grid's infinite row model reads `GET /api/variants` one page per block, with
 * the view's filters and the grid's sort, so a registry of 100,000 variants scrolls without loading
 * them all. The URL owns the view: a change of filters gives the grid a new datasource, and a sort or
 * column change from the URL (a shared link, back and forward) is applied to the grid's column state.
 */
export function VariantGrid({ view, energyUnit, roleStyles, onSortChange, toolbar }: VariantGridProps) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const [gridApi, setGridApi] = useState<GridApi<Row> | null>(null);
  const [load, setLoad] = useState<LoadState>({ kind: 'loading' });
  // Initial sort and visibility only: later changes go through the column state (effects below).
  const [initialView] = useState(view);
  const columnDefs = useMemo(() => columnDefinitions(energyUnit, roleStyles, initialView), [energyUnit, roleStyles, initialView]);

  const filtersKey = JSON.stringify(view.filters);
  const datasource = useMemo<IDatasource>(() => {
    const filters = JSON.parse(filtersKey) as RegistryFilters;
    return {
      getRows: (params) => {
        if (params.startRow === 0) setLoad({ kind: 'loading' });
        const page = Math.floor(params.startRow / registryBlockSize) + 1;
        const query = getVariantPageQueryOptions(variantListParams(filters, sortFromModel(params.sortModel), page, registryBlockSize));
        queryClient.fetchQuery(query).then(
          (result) => {
            params.successCallback(result.rows, result.total);
            setLoad({ kind: 'loaded', total: result.total });
          },
          (error: unknown) => {
            params.failCallback();
            setLoad({ kind: 'failed', error });
          },
        );
      },
    };
  }, [filtersKey, queryClient]);

  const { key: sortKey, order: sortOrder } = view.sort;
  useEffect(() => {
    if (!gridApi) return;
    const current = gridSort(gridApi);
    if (current.key === sortKey && current.order === sortOrder) return;
    gridApi.applyColumnState({ state: [{ colId: columnOfSortKey[sortKey], sort: sortOrder }], defaultState: { sort: null } });
  }, [gridApi, sortKey, sortOrder]);

  const columnsKey = view.columns.join(',');
  useEffect(() => {
    if (!gridApi) return;
    const visible = new Set(columnsKey.split(','));
    const hidden = registryColumnIds.filter((id) => id !== alwaysVisibleColumn && !visible.has(id));
    gridApi.setColumnsVisible([...visible], true);
    gridApi.setColumnsVisible(hidden, false);
  }, [gridApi, columnsKey]);

  const handleGridReady = useCallback((event: GridReadyEvent<Row>) => setGridApi(event.api), []);

  const handleSortChanged = useCallback(
    (event: SortChangedEvent<Row>) => {
      const sort = gridSort(event.api);
      if (sort.key !== sortKey || sort.order !== sortOrder) onSortChange(sort);
    },
    [sortKey, sortOrder, onSortChange],
  );

  const handleCellKeyDown = useCallback(
    (event: CellKeyDownEvent<Row>) => {
      const key = event.event instanceof KeyboardEvent ? event.event.key : null;
      if (key === 'Enter' && event.data) navigate(paths.variant.href(event.data.id));
    },
    [navigate],
  );

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm font-medium text-ink-700" aria-live="polite">
          {load.kind === 'loading' && 'Loading variants…'}
          {load.kind === 'loaded' && `${load.total.toLocaleString()} ${load.total === 1 ? 'variant matches' : 'variants match'}`}
          {load.kind === 'failed' && 'The variants could not be loaded.'}
        </p>
        {toolbar}
      </div>
      <div className="relative h-[calc(100vh-22rem)] min-h-[28rem]">
        <AgGridReact<Row>
          theme={registryGridTheme}
          rowModelType="infinite"
          datasource={datasource}
          cacheBlockSize={registryBlockSize}
          maxBlocksInCache={MAX_BLOCKS_IN_CACHE}
          infiniteInitialRowCount={registryBlockSize}
          getRowId={rowId}
          columnDefs={columnDefs}
          defaultColDef={defaultColDef}
          suppressMultiSort
          // Our own empty and error states sit over the grid, in our words.
          suppressNoRowsOverlay
          // Rows just past the visible ones are drawn ahead; fewer than the default keeps the first paint quick.
          rowBuffer={ROW_BUFFER}
          enableCellTextSelection
          ensureDomOrder
          onGridReady={handleGridReady}
          onSortChanged={handleSortChanged}
          onCellKeyDown={handleCellKeyDown}
        />
        {load.kind === 'loaded' && load.total === 0 && (
          <div className="absolute inset-x-4 top-16">
            {hasFilters(view.filters) ? (
              <EmptyState title="No variant matches these filters.">Loosen or clear a filter to see more of the registry.</EmptyState>
            ) : (
              <EmptyState title="The registry has no variants yet.">Variants registered in any campaign show up here.</EmptyState>
            )}
          </div>
        )}
        {load.kind === 'failed' && (
          <div className="absolute inset-x-4 top-16">
            <ErrorState error={load.error} onRetry={() => gridApi?.purgeInfiniteCache()} />
          </div>
        )}
      </div>
    </div>
  );
}
