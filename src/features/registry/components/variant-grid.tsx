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
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { VariantListRowDto } from '@shared/schemas/variant';
import { paths } from '@/config/paths';
import { getVariantPageQueryOptions } from '../api/get-variant-page';
import {
  alwaysVisibleColumn,
  defaultSort,
  registryBlockSize,
  registryColumnIds,
  variantListParams,
  type RegistryColumnId,
  type RegistryFilters,
  type RegistrySort,
  type RegistryView,
} from '../registry-view';
import { registryGridTheme } from './grid-theme';
import { columnOfSortKey, sortKeyOfColumn } from './variant-columns';

// Only what the grid uses beyond the core (which brings sorting, pinning, resizing and loading skeletons):
// the infinite row model, cell classes, and the column-state calls that keep the grid and the URL in step.
ModuleRegistry.registerModules([InfiniteRowModelModule, CellStyleModule, ColumnApiModule]);

type Row = VariantListRowDto;

/** Rows drawn beyond the visible ones, above and below. */
const ROW_BUFFER = 4;
/** Blocks kept in memory (2,000 rows); older ones are fetched again when scrolled back to. */
const MAX_BLOCKS_IN_CACHE = 20;

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

/** Where the grid's reading of the list stands: the count line and the empty and error states follow it. */
export type LoadState = { kind: 'loading' } | { kind: 'loaded'; total: number } | { kind: 'failed'; error: unknown };

export interface VariantGridProps {
  view: RegistryView;
  /** From columnDefinitions, for the view the page opened with; kept the same between renders. */
  columns: ColDef<Row>[];
  /** The reader sorted by a column header. */
  onSortChange: (sort: RegistrySort) => void;
  onLoadChange: (load: LoadState) => void;
  /** The grid is ready; its API reads the list again after a failure. */
  onGridReady: (api: GridApi<Row>) => void;
}

/**
 * The registry grid: AG Grid's infinite row model reads `GET /api/variants` one page per block, with
 * the view's filters and the grid's sort, so a registry of 100,000 variants scrolls without loading
 * them all. The URL owns the view: a change of filters gives the grid a new datasource, and a sort or
 * column change from the URL (a shared link, back and forward) is applied to the grid's column state.
 * Loaded on its own (it is most of the registry's code), after the first rows are drawn.
 */
export default function VariantGrid({ view, columns, onSortChange, onLoadChange, onGridReady }: VariantGridProps) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const [gridApi, setGridApi] = useState<GridApi<Row> | null>(null);

  const filtersKey = JSON.stringify(view.filters);
  const datasource = useMemo<IDatasource>(() => {
    const filters = JSON.parse(filtersKey) as RegistryFilters;
    return {
      getRows: (params) => {
        if (params.startRow === 0) onLoadChange({ kind: 'loading' });
        const page = Math.floor(params.startRow / registryBlockSize) + 1;
        const query = getVariantPageQueryOptions(variantListParams(filters, sortFromModel(params.sortModel), page, registryBlockSize));
        queryClient.fetchQuery(query).then(
          (result) => {
            params.successCallback(result.rows, result.total);
            onLoadChange({ kind: 'loaded', total: result.total });
          },
          (error: unknown) => {
            params.failCallback();
            onLoadChange({ kind: 'failed', error });
          },
        );
      },
    };
  }, [filtersKey, queryClient, onLoadChange]);

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

  const handleGridReady = useCallback(
    (event: GridReadyEvent<Row>) => {
      setGridApi(event.api);
      onGridReady(event.api);
    },
    [onGridReady],
  );

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
    <AgGridReact<Row>
      theme={registryGridTheme}
      rowModelType="infinite"
      datasource={datasource}
      cacheBlockSize={registryBlockSize}
      maxBlocksInCache={MAX_BLOCKS_IN_CACHE}
      infiniteInitialRowCount={registryBlockSize}
      getRowId={rowId}
      columnDefs={columns}
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
  );
}
