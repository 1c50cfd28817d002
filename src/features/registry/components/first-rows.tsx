import { createElement, type ComponentType } from 'react';
import type { ColDef, ValueGetterParams } from 'ag-grid-community';
import type { VariantListRowDto } from '@shared/schemas/variant';
import type { RegistryColumnId, RegistrySort } from '../registry-view';
import { sortKeyOfColumn } from './variant-columns';

type Row = VariantListRowDto;

// The grid's measures (grid-theme.ts and as drawn): header and row heights (borders included), the
// width its vertical scroll bar takes, and the page space above the grid box.
const HEADER_HEIGHT = 46;
const ROW_HEIGHT = 38;
const SCROLL_BAR_WIDTH = 16;
const SPACE_ABOVE_BOX = 22 * 16;
const MIN_BOX_HEIGHT = 28 * 16;

export interface FirstRowsProps {
  columns: readonly ColDef<Row>[];
  /** The first block's rows, or null while it is on its way (placeholder rows are drawn, as the grid does). */
  rows: readonly Row[] | null;
  visibleColumns: readonly RegistryColumnId[];
  sort: RegistrySort;
}

/**
 * The first screen of rows, drawn as a plain table in the grid's place and look while the grid's own code
 * loads and builds itself (about half a second on a modest machine), so the reader sees the variants at
 * once. The same column definitions give the same cells; the grid takes over once it has drawn its rows.
 */
export function FirstRows({ columns, rows, visibleColumns, sort }: FirstRowsProps) {
  const shown = columns.filter((column) => visibleColumns.includes(column.colId as RegistryColumnId));
  const rowsThatFit = Math.ceil((Math.max(window.innerHeight - SPACE_ABOVE_BOX, MIN_BOX_HEIGHT) - HEADER_HEIGHT) / ROW_HEIGHT);
  const width = shown.reduce((sum, column) => sum + (column.initialWidth ?? 200), 0);
  const drawn: (Row | undefined)[] = rows ? rows.slice(0, rowsThatFit) : Array.from({ length: rowsThatFit }, () => undefined);
  return (
    <div
      role="table"
      aria-label="Variants"
      aria-rowcount={rows ? rows.length + 1 : -1}
      aria-busy={rows === null}
      className="absolute inset-0 z-10 overflow-hidden rounded-lg border border-paper-300 bg-paper-50 text-sm text-ink-900"
      style={{ paddingRight: SCROLL_BAR_WIDTH }}
    >
      <div className="h-full overflow-hidden">
        <div role="row" className="flex border-b-2 border-lagoon-200 bg-lagoon-50 text-[12.5px] font-semibold text-lagoon-900" style={{ height: HEADER_HEIGHT, width }}>
          {shown.map((column, index) => (
            <div
              key={column.colId}
              role="columnheader"
              className={`relative flex shrink-0 items-center gap-1 px-3 ${column.type === 'rightAligned' ? 'justify-end' : ''} ${index === 0 ? 'border-r border-paper-300' : ''}`}
              style={{ width: column.initialWidth }}
            >
              <span className="truncate">{column.headerName}</span>
              {sortKeyOfColumn[column.colId as keyof typeof sortKeyOfColumn] === sort.key && <span aria-hidden>{sort.order === 'asc' ? '↑' : '↓'}</span>}
              {index < shown.length - 1 && <span aria-hidden className="absolute right-px top-[35%] h-[30%] w-0.5 bg-paper-300" />}
            </div>
          ))}
        </div>
        {drawn.map((row, index) => (
          <div key={row?.id ?? `loading-${index}`} role="row" className={`flex border-b border-paper-200 ${index % 2 === 1 ? 'bg-paper-100' : ''}`} style={{ height: ROW_HEIGHT, width }}>
            {shown.map((column, columnIndex) => (
              <div
                key={column.colId}
                role="cell"
                className={`flex shrink-0 items-center overflow-hidden whitespace-nowrap px-3 ${column.type === 'rightAligned' ? 'justify-end' : ''} ${typeof column.cellClass === 'string' ? column.cellClass : ''} ${columnIndex === 0 ? 'border-r border-paper-300' : ''}`}
                style={{ width: column.initialWidth }}
              >
                {cellContent(column, row)}
              </div>
            ))}
          </div>
        ))}
      </div>
    </div>
  );
}

function cellContent(column: ColDef<Row>, row: Row | undefined) {
  if (column.cellRenderer) return createElement(column.cellRenderer as ComponentType<Record<string, unknown>>, { ...column.cellRendererParams, data: row });
  const getter = column.valueGetter;
  return typeof getter === 'function' ? (getter({ data: row } as ValueGetterParams<Row>) as string | number | undefined) : null;
}
