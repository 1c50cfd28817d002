import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { importKindLabels, type ImportJobSummaryDto } from '@shared/schemas/import';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { ImportStatusBadge } from './import-status';

const column = createColumnHelper<ImportJobSummaryDto>();

const columns = [
  column.accessor('createdAt', { header: 'When', cell: (info) => <span className="whitespace-nowrap text-ink-600">{formatDateTime(info.getValue())}</span> }),
  column.accessor((job) => job.createdBy?.name ?? '—', { id: 'who', header: 'Who' }),
  column.accessor('kind', { header: 'Kind', cell: (info) => importKindLabels[info.getValue()] }),
  column.accessor('fileName', {
    header: 'File',
    cell: (info) => (
      <a href={info.row.original.fileUrl} className="break-words text-lagoon-700 underline-offset-2 hover:underline" title="Download the original file">
        {info.getValue()}
      </a>
    ),
  }),
  column.accessor('status', { header: 'Status', cell: (info) => <ImportStatusBadge status={info.getValue()} /> }),
  column.accessor('counts', {
    header: 'Rows',
    cell: (info) => {
      const { counts, status } = info.row.original;
      if (status === 'uploaded') return <span className="text-ink-500">not checked yet</span>;
      const parts = (['new', 'updated', 'unchanged', 'invalid'] as const).filter((key) => counts[key] > 0 || key === 'new');
      return (
        <span className="whitespace-nowrap text-xs">
          {parts.map((key, index) => (
            <span key={key}>
              {index > 0 && ' · '}
              <span className="font-mono">{counts[key].toLocaleString()}</span> {key}
            </span>
          ))}
        </span>
      );
    },
  }),
  column.display({
    id: 'open',
    header: () => <span className="sr-only">Open</span>,
    cell: (info) => (
      <Link to={paths.importJob.href(info.row.original.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
        Open<span className="sr-only"> import {info.row.original.fileName}</span>
      </Link>
    ),
  }),
];

/** Every import: who, when, what, and how it ended. */
export function ImportHistory({ jobs }: { jobs: ImportJobSummaryDto[] }) {
  const table = useReactTable({ data: jobs, columns, getCoreRowModel: getCoreRowModel() });
  return <DataTable table={table} caption="Import history, newest first" />;
}
