import type { ReviewStateName } from '@shared/schemas/measurement';

const styles: Record<ReviewStateName, { icon: string; label: string; className: string }> = {
  draft: { icon: '✎', label: 'Draft', className: 'border-paper-300 bg-paper-100 text-ink-700' },
  submitted: { icon: '◷', label: 'Submitted', className: 'border-lagoon-300 bg-lagoon-50 text-lagoon-900' },
  approved: { icon: '✓', label: 'Approved', className: 'border-signal-fine bg-signal-fine-soft text-signal-fine' },
  flagged: { icon: '⚑', label: 'Flagged', className: 'border-signal-caution bg-signal-caution-soft text-signal-caution' },
  retracted: { icon: '⊘', label: 'Retracted', className: 'border-paper-300 bg-white text-ink-500' },
};

/** A measurement's review state as an icon and a word, never colour alone. */
export function ReviewStateBadge({ state }: { state: ReviewStateName }) {
  const style = styles[state];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold ${style.className}`}>
      <span aria-hidden>{style.icon}</span>
      {style.label}
    </span>
  );
}
