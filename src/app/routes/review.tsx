import type { RowSelectionState } from '@tanstack/react-table';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { reviewQueuePageSize, useReviewQueue } from '@/features/review/api/get-review-queue';
import { ReviewActions, type ReviewOutcome } from '@/features/review/components/review-actions';
import { ReviewTable } from '@/features/review/components/review-table';

export default function ReviewRoute() {
  const [page, setPage] = useState(1);
  const queue = useReviewQueue(page);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [outcome, setOutcome] = useState<ReviewOutcome | null>(null);

  const pageCount = queue.data ? Math.max(1, Math.ceil(queue.data.total / reviewQueuePageSize)) : 1;
  // Reviewing the last rows of the last page leaves it empty: step back to one that has rows.
  if (queue.data && queue.data.items.length === 0 && page > 1 && !queue.isPlaceholderData) setPage(Math.min(page - 1, pageCount));

  const selected = queue.data?.items.filter((measurement) => selection[String(measurement.id)]) ?? [];

  const goToPage = (next: number) => {
    setSelection({});
    setPage(next);
  };

  return (
    <div className="space-y-4">
      <PageHeader
        title="Review"
        description="Submitted measurements wait here for a lead. Approve them, or flag them with a reason: flagged measurements are kept and shown but left out of comparisons, rankings and the landscape."
      />
      {outcome && (
        <Notice tone="fine" title={`${outcome.action === 'approve' ? 'Approved' : 'Flagged'} ${outcome.labels.length} ${outcome.labels.length === 1 ? 'measurement' : 'measurements'}`}>
          <p>
            Of <span className="font-mono">{[...new Set(outcome.labels)].join(', ')}</span>.
            {outcome.action === 'approve' ? ' They now count as reviewed.' : ' They no longer enter comparisons.'}
          </p>
        </Notice>
      )}
      {queue.isPending && <LoadingState label="Loading submitted measurements…" />}
      {queue.isError && <ErrorState error={queue.error} onRetry={() => void queue.refetch()} />}
      {queue.data && queue.data.total === 0 && (
        <EmptyState title="Nothing is waiting for review.">When a kineticist submits a measurement, it shows up here.</EmptyState>
      )}
      {queue.data && queue.data.total > 0 && (
        <div className="space-y-3">
          <div className="sticky top-0 z-10">
            <ReviewActions
              selected={selected}
              onReviewed={(result) => {
                setSelection({});
                setOutcome(result);
              }}
              onReload={() => {
                setSelection({});
                void queue.refetch();
              }}
            />
          </div>
          <section aria-label="Submitted measurements" className="space-y-3">
            <p className="text-sm text-ink-600">
              {queue.data.total} submitted {queue.data.total === 1 ? 'measurement' : 'measurements'}, newest first
              {pageCount > 1 && ` · page ${page} of ${pageCount}`}
            </p>
            <ReviewTable measurements={queue.data.items} selection={selection} onSelectionChange={setSelection} />
            {pageCount > 1 && (
              <nav aria-label="Pages of the review list" className="flex gap-2">
                <Button disabled={page <= 1} onClick={() => goToPage(page - 1)}>
                  ← Newer
                </Button>
                <Button disabled={page >= pageCount} onClick={() => goToPage(page + 1)}>
                  Older →
                </Button>
              </nav>
            )}
          </section>
        </div>
      )}
    </div>
  );
}
