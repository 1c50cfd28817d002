import { flexRender, type Row, type RowData, type Table } from '@tanstack/react-table';

declare module '@tanstack/react-table' {
  // The type parameters must repeat TanStack's declaration for the merge, though the field uses neither.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** A column of numbers: header and cells right-aligned, figures tabular. */
    numeric?: boolean;
  }
}

type Variant = 'card' | 'inset' | 'wide';

// `inset` sits inside a card, so it has no shadow of its own and tighter rows; `wide` has many columns, so
// its cells are narrower, and its headers keep their case because they carry units (s⁻¹, not S⁻¹).
const variants: Record<Variant, { frame: string; head: string; headCell: string; cell: string }> = {
  card: {
    frame: 'shadow-card',
    head: 'bg-paper-100 text-xs uppercase tracking-wide text-ink-600',
    headCell: 'px-3 py-2',
    cell: 'px-3 py-2',
  },
  inset: {
    frame: '',
    head: 'bg-paper-100 text-xs uppercase tracking-wide text-ink-600',
    headCell: 'px-3 py-2',
    cell: 'px-3 py-1.5',
  },
  wide: {
    frame: 'shadow-card',
    head: 'bg-lagoon-50 text-xs text-lagoon-900',
    headCell: 'px-2 py-2.5',
    cell: 'px-2 py-2',
  },
};

export interface DataTableProps<TData extends RowData> {
  /** The table from `useReactTable`; its columns, row ids and selection stay with the caller. */
  table: Table<TData>;
  /** Names the table for screen readers. */
  caption: string;
  variant?: Variant;
  /** `middle` for rows of one-line controls (selects, buttons), which look misaligned against top-aligned text. */
  cellAlign?: 'top' | 'middle';
  /** Extra classes for a row, e.g. to dim one that no longer counts. Selected rows are tinted regardless. */
  rowClassName?: (row: Row<TData>) => string | undefined;
}

/** A TanStack table in the app's look: header row, one row per record, numeric columns right-aligned. */
export function DataTable<TData extends RowData>({ table, caption, variant = 'card', cellAlign = 'top', rowClassName }: DataTableProps<TData>) {
  const style = variants[variant];
  return (
    <div className={`overflow-x-auto rounded-lg border border-paper-200 bg-white ${style.frame}`}>
      <table className="min-w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className={`text-left ${style.head}`}>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <th key={header.id} scope="col" className={`${style.headCell} font-semibold ${header.column.columnDef.meta?.numeric ? 'text-right' : ''}`}>
                  {flexRender(header.column.columnDef.header, header.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-paper-200">
          {table.getRowModel().rows.map((row) => {
            const className = [rowClassName?.(row), row.getIsSelected() ? 'bg-lagoon-50' : undefined].filter(Boolean).join(' ');
            return (
              <tr key={row.id} className={className || undefined}>
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={`${style.cell} ${cellAlign === 'middle' ? 'align-middle' : 'align-top'} ${cell.column.columnDef.meta?.numeric ? 'numeric' : ''}`}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
