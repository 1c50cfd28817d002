import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { bulkReviewInput, type BulkReviewInput, type MeasurementDto } from '@shared/schemas/measurement';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useReviewMeasurements, type ReviewMeasurementsInput } from '../api/review-measurements';

export interface ReviewOutcome {
  action: 'approve' | 'flag';
  labels: string[];
}

export interface ReviewActionsProps {
  selected: MeasurementDto[];
  onReviewed: (outcome: ReviewOutcome) => void;
  /** Loads the list again, after someone else changed a measurement first. */
  onReload: () => void;
}

/**
 * Approve or flag the selected measurements in one request (all change or none). A flag needs a
 * reason, which is kept with the measurement and in the audit trail; an approval may carry a note.
 */
export function ReviewActions({ selected, onReviewed, onReload }: ReviewActionsProps) {
  const review = useReviewMeasurements();
  const reasonId = useId();
  const form = useForm<ReviewMeasurementsInput, unknown, BulkReviewInput>({
    resolver: zodResolver(bulkReviewInput),
    defaultValues: { items: [], action: 'approve', reason: '' },
  });
  const errors = form.formState.errors;
  const count = selected.length;
  const noun = count === 1 ? 'measurement' : 'measurements';

  const submit = (action: ReviewOutcome['action']) => {
    review.reset();
    form.setValue('action', action);
    form.setValue(
      'items',
      selected.map((measurement) => ({ id: measurement.id, version: measurement.version })),
    );
    void form.handleSubmit((values) => {
      const labels = selected.map((measurement) => measurement.variant.label);
      review.mutate(values, {
        onSuccess: () => {
          form.reset();
          onReviewed({ action, labels });
        },
        // Field problems go on the reason; conflicts and refusals are explained above the buttons.
        onError: (error) => {
          if (error instanceof ApiError && error.status === 400) applyServerErrors(error, form.setError);
        },
      });
    })();
  };

  const failure = review.error instanceof ApiError && review.error.status !== 400 ? review.error : null;
  const unreachable = review.isError && !(review.error instanceof ApiError);

  return (
    <form
      noValidate
      onSubmit={(event) => event.preventDefault()}
      aria-label="Review the selected measurements"
      className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card"
    >
      {failure && (
        <Notice
          tone="danger"
          title={
            failure.code === 'stale_version'
              ? 'Someone changed one of these measurements first'
              : failure.code === 'invalid_transition'
                ? 'One of these measurements is no longer waiting for review'
                : 'The review was refused'
          }
        >
          <p>
            {failure.message}
            {/nothing was changed/i.test(failure.message) ? '' : ' Nothing was changed.'}
          </p>
          {(failure.code === 'stale_version' || failure.code === 'invalid_transition') && (
            <Button
              className="mt-2"
              onClick={() => {
                review.reset();
                onReload();
              }}
            >
              Reload the list
            </Button>
          )}
        </Notice>
      )}
      {unreachable && <Notice tone="danger" title="The server could not be reached. Nothing was changed; try again." />}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      <div className="flex flex-wrap items-start gap-4">
        <p className="w-44 pt-1 text-sm font-semibold text-ink-900" aria-live="polite">
          {count === 0 ? 'Select measurements in the list to approve or flag them.' : `${count} ${noun} selected`}
        </p>
        <div className="min-w-72 flex-1 space-y-1">
          <label htmlFor={reasonId} className="block text-sm font-medium text-ink-700">
            Reason <span className="font-normal text-ink-500">(required to flag; a note for an approval)</span>
          </label>
          <textarea
            id={reasonId}
            rows={1}
            aria-invalid={errors.reason ? true : undefined}
            aria-describedby={errors.reason ? `${reasonId}-error` : undefined}
            className={`block w-full rounded-md border bg-white px-3 py-2 text-sm text-ink-900 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200 ${errors.reason ? 'border-signal-danger' : 'border-paper-300'}`}
            {...form.register('reason')}
          />
          {errors.reason && (
            <p id={`${reasonId}-error`} className="flex items-center gap-1 text-sm text-signal-danger">
              <span aria-hidden>⚠</span> Reason {errors.reason.message}
            </p>
          )}
        </div>
        <div className="flex flex-wrap gap-2 pt-6">
          <Button
            variant="primary"
            disabled={count === 0 || review.isPending}
            busy={review.isPending && form.getValues('action') === 'approve'}
            onClick={() => submit('approve')}
          >
            <span aria-hidden>✓</span> Approve {count > 0 ? `${count} ${noun}` : 'selected'}
          </Button>
          <Button
            variant="danger"
            disabled={count === 0 || review.isPending}
            busy={review.isPending && form.getValues('action') === 'flag'}
            onClick={() => submit('flag')}
          >
            <span aria-hidden>⚑</span> Flag {count > 0 ? `${count} ${noun}` : 'selected'}
          </Button>
        </div>
      </div>
    </form>
  );
}
