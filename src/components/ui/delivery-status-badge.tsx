import type { OutboxStatus } from '@shared/schemas/mail';

const styles: Record<OutboxStatus, { icon: string; label: string; className: string }> = {
  queued: { icon: '◷', label: 'Queued', className: 'bg-paper-100 text-ink-700' },
  sending: { icon: '↻', label: 'Sending', className: 'bg-lagoon-50 text-lagoon-900' },
  sent: { icon: '✓', label: 'Sent', className: 'bg-signal-fine-soft text-signal-fine' },
  failed: { icon: '⚠', label: 'Failed', className: 'bg-signal-danger-soft text-signal-danger' },
};

/** A delivery state as a word with an icon, never by colour alone. */
export function DeliveryStatusBadge({ status }: { status: OutboxStatus }) {
  const style = styles[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-xs font-semibold ${style.className}`}>
      <span aria-hidden>{style.icon}</span>
      {style.label}
    </span>
  );
}
