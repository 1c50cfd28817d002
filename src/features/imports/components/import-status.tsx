import type { ImportStatus } from '@shared/schemas/import';

const statusText: Record<ImportStatus, { icon: string; label: string; className: string }> = {
  uploaded: { icon: '○', label: 'Uploaded', className: 'border-paper-300 bg-paper-100 text-ink-700' },
  validating: { icon: '◔', label: 'Checking rows', className: 'border-lagoon-300 bg-lagoon-50 text-lagoon-900' },
  previewed: { icon: '◑', label: 'Checked', className: 'border-lagoon-300 bg-lagoon-50 text-lagoon-900' },
  committing: { icon: '◕', label: 'Importing', className: 'border-ember-400 bg-ember-50 text-ember-700' },
  committed: { icon: '✓', label: 'Imported', className: 'border-signal-fine bg-signal-fine-soft text-signal-fine' },
  failed: { icon: '⚠', label: 'Not imported', className: 'border-signal-danger bg-signal-danger-soft text-signal-danger' },
};

/** Where a job stands, in words with an icon (never colour alone). */
export function ImportStatusBadge({ status }: { status: ImportStatus }) {
  const style = statusText[status];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-medium ${style.className}`}>
      <span aria-hidden>{style.icon}</span>
      {style.label}
    </span>
  );
}
