import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { cofactorLabels, type EnzymeSummaryDto } from '@shared/schemas/enzyme';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';

const column = createColumnHelper<EnzymeSummaryDto>();

const columns = [
  column.accessor('name', {
    header: 'Name',
    cell: (info) => (
      <Link to={paths.enzyme.href(info.row.original.id)} className="font-semibold text-lagoon-700 underline-offset-2 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('ecNumber', { header: 'EC', cell: (info) => <span className="font-mono">{info.getValue() ?? '—'}</span> }),
  column.accessor('organism', { header: 'Organism', cell: (info) => <span className="text-ink-700">{info.getValue()}</span> }),
  column.accessor('sequenceLength', {
    header: () => <span className="block text-right">Residues</span>,
    cell: (info) => <span className="numeric block font-mono">{info.getValue()}</span>,
  }),
  column.accessor('cofactors', {
    header: 'Cofactors',
    cell: (info) => {
      const labels = [...info.getValue().map((cofactor) => cofactorLabels[cofactor]), ...(info.row.original.otherCofactors ? [info.row.original.otherCofactors] : [])];
      return labels.length > 0 ? labels.join(', ') : <span className="text-ink-500">none</span>;
    },
  }),
  column.accessor('siteCount', {
    header: () => <span className="block text-right">Sites</span>,
    cell: (info) => <span className="numeric block font-mono">{info.getValue()}</span>,
  }),
  column.accessor('campaignCount', {
    header: () => <span className="block text-right">Campaigns</span>,
    cell: (info) => <span className="numeric block font-mono">{info.getValue()}</span>,
  }),
  column.accessor('updatedAt', { header: 'Changed', cell: (info) => <span className="whitespace-nowrap text-ink-600">{formatDate(info.getValue())}</span> }),
];

/** Every parent enzyme, by name, without sequences. */
export function EnzymesTable({ enzymes }: { enzymes: EnzymeSummaryDto[] }) {
  const table = useReactTable({ data: enzymes, columns, getCoreRowModel: getCoreRowModel(), getRowId: (row) => String(row.id) });
  return (
    <div className="overflow-x-auto rounded-lg border border-paper-200 bg-white shadow-card">
      <table className="min-w-full text-sm">
        <caption className="sr-only">Enzymes</caption>
        <thead className="bg-paper-100 text-left text-xs uppercase tracking-wide text-ink-600">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <th key={header.id} scope="col" className="px-3 py-2 font-semibold">
                  {flexRender(header.column.columnDef.header, header.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-paper-200">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="hover:bg-paper-50">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-top">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
