import type { VariantStatus } from '@shared/schemas/variant';

/** Where a construct stands, as words; the pipeline step is also given as "step n of 6" for screen readers. */
export const variantStatusLabels: Record<VariantStatus, string> = {
  designed: 'Designed',
  cloned: 'Cloned',
  'sequence-verified': 'Sequence-verified',
  expressed: 'Expressed',
  purified: 'Purified',
  characterized: 'Characterized',
  failed: 'Failed',
  archived: 'Archived',
};

const pipeline: readonly VariantStatus[] = ['designed', 'cloned', 'sequence-verified', 'expressed', 'purified', 'characterized'];

/** A status with a row of pips for the pipeline steps reached, or a mark for the two ends outside it. */
export function VariantStatusBadge({ status }: { status: VariantStatus }) {
  const step = pipeline.indexOf(status);
  if (step === -1) {
    return (
      <span className="inline-flex items-center gap-1.5 rounded-full border border-paper-300 bg-paper-100 px-2 py-0.5 text-xs font-semibold text-ink-700">
        <span aria-hidden>{status === 'failed' ? '✕' : '▪'}</span>
        {variantStatusLabels[status]}
      </span>
    );
  }
  return (
    <span className="inline-flex items-center gap-2 rounded-full border border-lagoon-200 bg-lagoon-50 px-2 py-0.5 text-xs font-semibold text-lagoon-900">
      <span aria-hidden className="flex gap-0.5">
        {pipeline.map((name, index) => (
          <span key={name} className={`size-1.5 rounded-full ${index <= step ? 'bg-lagoon-700' : 'bg-lagoon-200'}`} />
        ))}
      </span>
      {variantStatusLabels[status]}
      <span className="sr-only">
        {' '}
        (step {step + 1} of {pipeline.length})
      </span>
    </span>
  );
}
