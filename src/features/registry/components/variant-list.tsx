import { useQuery } from '@tanstack/react-query';
import type { GridApi } from 'ag-grid-community';
import { useCallback, useEffect, useMemo, useRef, useState, type ComponentType, type ReactNode } from 'react';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { VariantListRowDto } from '@shared/schemas/variant';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { getVariantPageQueryOptions } from '../api/get-variant-page';
import { hasFilters, registryBlockSize, variantListParams, type RegistrySort, type RegistryView } from '../registry-view';
import { FirstRows } from './first-rows';
import type { RoleStyles } from './variant-cells';
import { columnDefinitions } from './variant-columns';
import type { LoadState, VariantGridProps } from './variant-grid';

/** How many frames to wait for the grid to show the rows it has read before it is shown anyway. */
const FRAMES_FOR_GRID_ROWS = 60;

export interface VariantListProps {
  view: RegistryView;
  energyUnit: EnergyUnit;
  roleStyles: RoleStyles;
  /** The reader sorted by a column header. */
  onSortChange: (sort: RegistrySort) => void;
  /** Controls shown on the line above the grid, beside the row count. */
  toolbar?: ReactNode;
}

/**
 * The registry's variants: the first screen of rows drawn at once from the first block (which the route's
 * loader has usually fetched already), then the grid, built in the same place after those rows are on
 * screen, takes over as soon as it shows its own. Above it, the count and the toolbar; over it, our empty
 * and error states.
 */
export function VariantList({ view, energyUnit, roleStyles, onSortChange, toolbar }: VariantListProps) {
  // Initial sort and visibility only: later changes go through the grid's column state.
  const [initialView] = useState(view);
  const columns = useMemo(() => columnDefinitions(energyUnit, roleStyles, initialView), [energyUnit, roleStyles, initialView]);
  const [gridLoad, setGridLoad] = useState<LoadState | null>(null);
  const [gridShown, setGridShown] = useState(false);
  const [grid, setGrid] = useState<{ Grid: ComponentType<VariantGridProps> } | { failed: unknown } | null>(null);
  const gridApi = useRef<GridApi<VariantListRowDto> | null>(null);
  const box = useRef<HTMLDivElement>(null);

  const firstBlock = useQuery({ ...getVariantPageQueryOptions(variantListParams(view.filters, view.sort, 1, registryBlockSize)), enabled: !gridShown });
  const firstBlockRead = firstBlock.isSuccess;

  // The grid's code is asked for once the first rows are painted (a frame, then a task after it), so its
  // half second of building comes after them rather than before. After a failed first read it waits for
  // "Try again", so the error stays until the reader asks. Not through React.lazy and Suspense:
  // React holds back content that follows a fallback for up to 300 ms, which would keep the grid waiting.
  const gridPending = grid === null;
  useEffect(() => {
    if (!gridPending || !firstBlockRead) return;
    let cancelled = false;
    let timer = 0;
    const frame = requestAnimationFrame(() => {
      timer = window.setTimeout(() => {
        import('./variant-grid').then(
          (module) => !cancelled && setGrid({ Grid: module.default }),
          (error: unknown) => !cancelled && setGrid({ failed: error }),
        );
      });
    });
    return () => {
      cancelled = true;
      cancelAnimationFrame(frame);
      window.clearTimeout(timer);
    };
  }, [gridPending, firstBlockRead]);

  // Once the grid has read its rows, it is shown when it has drawn them.
  const gridLoaded = gridLoad !== null && gridLoad.kind !== 'loading';
  useEffect(() => {
    if (gridShown || !gridLoaded) return;
    let frames = 0;
    let frame = 0;
    const check = () => {
      frames += 1;
      const drawn = box.current?.querySelector('.ag-row:not(.ag-row-loading) .ag-cell') !== null;
      if (drawn || frames >= FRAMES_FOR_GRID_ROWS) setGridShown(true);
      else frame = requestAnimationFrame(check);
    };
    frame = requestAnimationFrame(check);
    return () => cancelAnimationFrame(frame);
  }, [gridShown, gridLoaded]);

  const handleGridReady = useCallback((api: GridApi<VariantListRowDto>) => {
    gridApi.current = api;
  }, []);

  // The grid's own reading once it is shown; before that, the first block's.
  let load: LoadState = { kind: 'loading' };
  if (grid && 'failed' in grid) load = { kind: 'failed', error: grid.failed };
  else if (gridShown && gridLoad) load = gridLoad;
  else if (firstBlock.isSuccess) load = { kind: 'loaded', total: firstBlock.data.total };
  else if (firstBlock.isError) load = { kind: 'failed', error: firstBlock.error };

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
      <div ref={box} className="relative h-[calc(100vh-22rem)] min-h-[28rem]">
        {grid && 'Grid' in grid && (
          <grid.Grid
            view={view}
            columns={columns}
            onSortChange={onSortChange}
            onLoadChange={setGridLoad}
            onGridReady={handleGridReady}
          />
        )}
        {!gridShown && (firstBlock.isPending || (firstBlock.isSuccess && firstBlock.data.rows.length > 0)) && (
          <FirstRows columns={columns} rows={firstBlock.data?.rows ?? null} visibleColumns={view.columns} sort={view.sort} />
        )}
        {load.kind === 'loaded' && load.total === 0 && (
          <div className="absolute inset-x-4 top-16 z-20">
            {hasFilters(view.filters) ? (
              <EmptyState title="No variant matches these filters.">Loosen or clear a filter to see more of the registry.</EmptyState>
            ) : (
              <EmptyState title="The registry has no variants yet.">Variants registered in any campaign show up here.</EmptyState>
            )}
          </div>
        )}
        {load.kind === 'failed' && (
          <div className="absolute inset-x-4 top-16 z-20">
            <ErrorState
              error={load.error}
              onRetry={() => {
                // The browser remembers a module that failed to load, so only a reload asks for it again.
                if (grid && 'failed' in grid) window.location.reload();
                else if (gridApi.current) gridApi.current.purgeInfiniteCache();
                else void firstBlock.refetch();
              }}
            />
          </div>
        )}
      </div>
    </div>
  );
}
