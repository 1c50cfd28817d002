import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import type { DigestRunSummaryDto } from '@shared/schemas/digest';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate, formatDateTime } from '@/lib/format';
import { useDigestRuns } from '../api/get-digest-runs';

const column = createColumnHelper<DigestRunSummaryDto>();

function deliveryText(run: DigestRunSummaryDto): string {
  const parts = [
    run.delivery.sent > 0 ? `✓ ${run.delivery.sent} sent` : '',
    run.delivery.queued + run.delivery.sending > 0 ? `◷ ${run.delivery.queued + run.delivery.sending} waiting` : '',
    run.delivery.failed > 0 ? `⚠ ${run.delivery.failed} failed` : '',
  ].filter(Boolean);
  return parts.join(', ') || (run.status === 'preparing' ? 'being prepared' : 'no recipients');
}

/** A campaign's past digests, newest first. */
export function DigestRunsTable({ campaignId, page, onPage, onOpen }: { campaignId: number; page: number; onPage: (page: number) => void; onOpen: (runId: number) => void }) {
  const runs = useDigestRuns(campaignId, page);
  const columns = useMemo(
    () => [
      column.accessor('scheduledFor', { header: 'When', cell: (info) => formatDateTime(info.getValue()) }),
      column.display({
        id: 'kind',
        header: 'Kind',
        cell: (info) => {
          const run = info.row.original;
          return run.kind === 'scheduled' ? `Weekly, ${formatDate(run.scheduledFor)}` : `Sent now by ${run.triggeredBy?.name ?? 'someone'}`;
        },
      }),
      column.accessor('recipientCount', { header: 'Recipients', cell: (info) => info.getValue(), meta: { numeric: true } }),
      column.display({ id: 'delivery', header: 'Delivery', cell: (info) => deliveryText(info.row.original) }),
      column.display({
        id: 'open',
        header: () => <span className="sr-only">Open</span>,
        cell: (info) => (
          <Button variant="quiet" className="px-2 py-1" onClick={() => onOpen(info.row.original.id)} aria-label={`Open the digest of ${formatDateTime(info.row.original.scheduledFor)}`}>
            Open
          </Button>
        ),
      }),
    ],
    [onOpen],
  );
  const table = useReactTable({ data: runs.data?.rows ?? [], columns, getCoreRowModel: getCoreRowModel() });

  if (runs.isPending) return <LoadingState label="Loading past digests…" />;
  if (runs.isError) return <ErrorState error={runs.error} onRetry={() => void runs.refetch()} />;
  if (runs.data.total === 0) {
    return (
      <EmptyState title="No digest has been sent for this campaign yet.">
        The weekly run sends one, or a lead can send one now; every digest sent is kept here with its content.
      </EmptyState>
    );
  }
  const pages = Math.ceil(runs.data.total / runs.data.pageSize);
  return (
    <div className="space-y-2">
      <DataTable table={table} caption="Past digests" cellAlign="middle" />
      {pages > 1 && (
        <div className="flex items-center justify-between text-sm text-ink-600">
          <Button variant="quiet" disabled={page <= 1} onClick={() => onPage(page - 1)}>
            ← Newer
          </Button>
          <span>
            Page {page} of {pages}
          </span>
          <Button variant="quiet" disabled={page >= pages} onClick={() => onPage(page + 1)}>
            Older →
          </Button>
        </div>
      )}
    </div>
  );
}
