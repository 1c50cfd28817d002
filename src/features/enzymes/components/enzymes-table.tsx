import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { cofactorLabels, type EnzymeSummaryDto } from '@shared/schemas/enzyme';
import { DataTable } from '@/components/ui/data-table';
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
    header: 'Residues',
    cell: (info) => <span className="font-mono">{info.getValue()}</span>,
    meta: { numeric: true },
  }),
  column.accessor('cofactors', {
    header: 'Cofactors',
    cell: (info) => {
      const labels = [...info.getValue().map((cofactor) => cofactorLabels[cofactor]), ...(info.row.original.otherCofactors ? [info.row.original.otherCofactors] : [])];
      return labels.length > 0 ? labels.join(', ') : <span className="text-ink-500">none</span>;
    },
  }),
  column.accessor('siteCount', {
    header: 'Sites',
    cell: (info) => <span className="font-mono">{info.getValue()}</span>,
    meta: { numeric: true },
  }),
  column.accessor('campaignCount', {
    header: 'Campaigns',
    cell: (info) => <span className="font-mono">{info.getValue()}</span>,
    meta: { numeric: true },
  }),
  column.accessor('updatedAt', { header: 'Changed', cell: (info) => <span className="whitespace-nowrap text-ink-600">{formatDate(info.getValue())}</span> }),
];

/** Every parent enzyme, by name, without sequences. */
export function EnzymesTable({ enzymes }: { enzymes: EnzymeSummaryDto[] }) {
  const table = useReactTable({ data: enzymes, columns, getCoreRowModel: getCoreRowModel(), getRowId: (row) => String(row.id) });
  return <DataTable table={table} caption="Enzymes" rowClassName={() => 'hover:bg-paper-50'} />;
}
