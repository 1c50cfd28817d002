import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { reviewMeasurementInput, reviewTransitions, type MeasurementDto, type ReviewAction, type ReviewMeasurementInput } from '@shared/schemas/measurement';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { isStaleVersion, StaleVersionNotice } from '@/components/ui/stale-version-notice';
import { TextAreaField } from '@/components/ui/text-area-field';
import { ApiError } from '@/lib/api-client';
import { formatPh } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { useReviewMeasurement } from '../api/review-measurement';
import { formatKcatOverKmWithSe, formatKcatWithSe, formatKmWithSe, kmUnitFor } from '../format-estimates';
import { MeasurementFlags } from './measurement-flags';
import { KcatOverKmSymbol, KcatSymbol, KmSymbol } from './rate-symbols';
import { ReviewStateBadge } from './review-state-badge';

export interface ReviewPermissions {
  /** Kineticists, leads and admins submit drafts. */
  canSubmit: boolean;
  /** Leads and admins approve and flag. */
  canReview: boolean;
}

interface MeasurementsTableProps extends ReviewPermissions {
  measurements: readonly MeasurementDto[];
  onReload: () => void;
}

const modelNames: Record<MeasurementDto['model'], string> = {
  'michaelis-menten': 'Michaelis–Menten',
  'substrate-inhibition': 'Substrate inhibition',
  hill: 'Hill',
};

const column = createColumnHelper<MeasurementDto>();

/** Which review actions this person may take on a measurement in its current state. */
function actionsFor(measurement: MeasurementDto, permissions: ReviewPermissions): ReviewAction[] {
  if (measurement.supersededById !== null) return [];
  const allowed: ReviewAction[] = [];
  if (permissions.canSubmit && reviewTransitions.submit.from.includes(measurement.reviewState)) allowed.push('submit');
  if (permissions.canReview && reviewTransitions.approve.from.includes(measurement.reviewState)) allowed.push('approve');
  if (permissions.canReview && reviewTransitions.flag.from.includes(measurement.reviewState)) allowed.push('flag');
  return allowed;
}

/**
 * The variant's measurements, one row each, with conditions, parameters ± SE, review state, flags and
 * reporting completeness; review actions for those whose role allows them. Refits that were superseded
 * are hidden until asked for.
 */
export function MeasurementsTable({ measurements, canSubmit, canReview, onReload }: MeasurementsTableProps) {
  const review = useReviewMeasurement();
  const [showSuperseded, setShowSuperseded] = useState(false);
  const [flagging, setFlagging] = useState<MeasurementDto | null>(null);
  const [done, setDone] = useState<MeasurementDto | null>(null);
  const superseded = measurements.filter((measurement) => measurement.supersededById !== null).length;
  const rows = useMemo(
    () => (showSuperseded ? [...measurements] : measurements.filter((measurement) => measurement.supersededById === null)),
    [measurements, showSuperseded],
  );

  const kmUnit = kmUnitFor(measurements.map((measurement) => measurement.km?.value));
  const columns = useMemo(() => {
    const permissions = { canSubmit, canReview };
    const handleAction = (measurement: MeasurementDto, action: ReviewAction) => {
      setDone(null);
      if (action === 'flag') {
        review.reset();
        setFlagging(measurement);
        return;
      }
      review.mutate({ id: measurement.id, version: measurement.version, action }, { onSuccess: setDone });
    };
    return [
      column.accessor('id', {
        header: 'Measurement',
        cell: (info) => {
          const measurement = info.row.original;
          return (
            <div className="min-w-36">
              <p className="font-mono font-semibold">#{measurement.id}</p>
              <p className="text-xs text-ink-600">
                {modelNames[measurement.model]}, {measurement.source === 'fitted' ? `fitted to ${measurement.pointCount ?? '?'} points` : 'entered as reported'}
              </p>
              <p className="text-xs text-ink-500">
                assay {measurement.assayId} · {measurement.conditions.assayDate}
              </p>
              {measurement.supersededById !== null && <p className="text-xs text-ink-500">superseded by #{measurement.supersededById}</p>}
            </div>
          );
        },
      }),
      column.accessor((measurement) => measurement.conditions, {
        id: 'conditions',
        header: 'Conditions',
        cell: (info) => {
          const conditions = info.getValue();
          return (
            <div className="min-w-40 max-w-52">
              <p className="whitespace-nowrap text-ink-900">
                {Number(conditions.temperatureC.toFixed(1))} °C · pH {formatPh(conditions.ph)}
              </p>
              <p className="text-xs text-ink-500">
                {conditions.substrate}
                {conditions.buffer && <> · {conditions.buffer.name}</>}
              </p>
            </div>
          );
        },
      }),
      column.accessor('kcat', {
        header: () => (
          <span className="whitespace-nowrap">
            <KcatSymbol /> <span className="normal-case">(s⁻¹)</span>
          </span>
        ),
        cell: (info) => <span className="whitespace-nowrap font-mono">{formatKcatWithSe(info.getValue(), false)}</span>,
        meta: { numeric: true },
      }),
      column.accessor('km', {
        header: () => (
          <span className="whitespace-nowrap">
            <KmSymbol /> <span className="normal-case">({kmUnit})</span>
          </span>
        ),
        cell: (info) => <span className="whitespace-nowrap font-mono">{formatKmWithSe(info.getValue(), kmUnit, false)}</span>,
        meta: { numeric: true },
      }),
      column.accessor('kcatOverKm', {
        header: () => (
          <span className="whitespace-nowrap">
            <KcatOverKmSymbol /> <span className="normal-case">(M⁻¹ s⁻¹)</span>
          </span>
        ),
        cell: (info) => <span className="whitespace-nowrap font-mono">{formatKcatOverKmWithSe(info.getValue(), false)}</span>,
        meta: { numeric: true },
      }),
      column.accessor('reviewState', {
        header: 'Review',
        cell: (info) => {
          const measurement = info.row.original;
          return (
            <div className="space-y-1">
              <ReviewStateBadge state={measurement.reviewState} />
              {measurement.reviewReason && <p className="max-w-56 text-xs text-ink-600">“{measurement.reviewReason}”</p>}
              {!measurement.counts && measurement.supersededById === null && <p className="text-xs text-ink-500">not counted in comparisons</p>}
            </div>
          );
        },
      }),
      column.display({
        id: 'flags',
        header: 'Flags',
        cell: (info) => (
          <div className="max-w-64 text-xs">
            <MeasurementFlags measurement={info.row.original} />
          </div>
        ),
      }),
      column.accessor((measurement) => measurement.completeness.score, {
        id: 'completeness',
        header: 'STRENDA',
        cell: (info) => {
          const { score, missing } = info.row.original.completeness;
          return (
            <>
              <span className="font-mono">{Math.round(score * 100)} %</span>
              <p className="text-xs text-ink-500">{missing.length === 0 ? 'complete' : `${missing.length} missing`}</p>
            </>
          );
        },
        meta: { numeric: true },
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Review actions</span>,
        cell: (info) => {
          const measurement = info.row.original;
          const allowed = actionsFor(measurement, permissions);
          if (allowed.length === 0) return null;
          return (
            <div className="flex flex-col gap-1 whitespace-nowrap">
              {allowed.map((action) => (
                <Button
                  key={action}
                  variant={action === 'approve' ? 'primary' : action === 'flag' ? 'danger' : 'secondary'}
                  className="px-2.5 py-1 text-xs"
                  disabled={review.isPending}
                  aria-label={`${actionLabels[action]} measurement ${measurement.id}`}
                  onClick={() => handleAction(measurement, action)}
                >
                  {actionLabels[action]}
                </Button>
              ))}
            </div>
          );
        },
      }),
    ];
  }, [canSubmit, canReview, review, kmUnit]);

  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), getRowId: (row) => String(row.id) });
  const failure = review.error instanceof ApiError ? review.error : review.error ? new ApiError(0, 'network', 'The server could not be reached.') : null;

  return (
    <div className="space-y-3">
      {failure &&
        (isStaleVersion(failure) ? (
          <StaleVersionNotice
            what="measurement"
            onReload={() => {
              review.reset();
              onReload();
            }}
          />
        ) : (
          <Notice tone="danger" title="The review was refused">
            {failure.message}
          </Notice>
        ))}
      {done && !failure && <Notice tone="fine" title={`Measurement ${done.id} is now ${done.reviewState}.`} />}
      {flagging && (
        <FlagForm
          measurement={flagging}
          onReload={onReload}
          onDone={(flagged) => {
            setFlagging(null);
            setDone(flagged);
          }}
        />
      )}
      <DataTable
        table={table}
        caption="Measurements of this variant"
        rowClassName={(row) => (row.original.supersededById !== null || row.original.reviewState === 'retracted' ? 'bg-paper-50 text-ink-600' : undefined)}
      />
      {superseded > 0 && (
        <label className="inline-flex items-center gap-2 text-sm text-ink-700">
          <input type="checkbox" checked={showSuperseded} onChange={(event) => setShowSuperseded(event.target.checked)} className="size-4 accent-lagoon-700" />
          Show {superseded} superseded {superseded === 1 ? 'refit' : 'refits'}
        </label>
      )}
    </div>
  );
}

const actionLabels: Record<ReviewAction, string> = {
  submit: 'Submit for review',
  approve: 'Approve',
  flag: 'Flag…',
  retract: 'Retract…',
};

interface FlagFormProps {
  measurement: MeasurementDto;
  onReload: () => void;
  /** Called with the flagged measurement, or null when cancelled. */
  onDone: (flagged: MeasurementDto | null) => void;
}

function FlagForm({ measurement, onReload, onDone }: FlagFormProps) {
  const review = useReviewMeasurement();
  const form = useForm<z.input<typeof reviewMeasurementInput>, unknown, ReviewMeasurementInput>({
    resolver: zodResolver(reviewMeasurementInput),
    defaultValues: { version: measurement.version, action: 'flag', reason: '' },
  });
  const error = form.formState.errors.reason?.message;

  const handleSubmit = form.handleSubmit((values) => {
    review.mutate(
      { id: measurement.id, version: values.version, action: 'flag', reason: values.reason },
      {
        onSuccess: onDone,
        onError: (failure) => {
          if (!isStaleVersion(failure)) applyServerErrors(failure, form.setError);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-3 rounded-lg border border-signal-caution bg-signal-caution-soft p-4">
      <h3 className="font-semibold text-ink-900">Flag measurement #{measurement.id}</h3>
      <p className="text-sm text-ink-700">A flagged measurement stays visible but leaves the comparisons, the summary and the cycles until a lead approves it again.</p>
      {isStaleVersion(review.error) && (
        <StaleVersionNotice
          what="measurement"
          onReload={() => {
            onDone(null);
            onReload();
          }}
        />
      )}
      {form.formState.errors.root?.server && <Notice tone="danger" title={form.formState.errors.root.server.message} />}
      <TextAreaField label="Reason (kept with the measurement and in the audit trail)" rows={3} error={error} {...form.register('reason')} />
      <div className="flex gap-2">
        <Button type="submit" variant="danger" busy={review.isPending}>
          Flag measurement
        </Button>
        <Button onClick={() => onDone(null)}>Cancel</Button>
      </div>
    </form>
  );
}
