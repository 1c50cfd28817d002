import { Button } from '@/components/ui/button';
import { DeliveryStatusBadge } from '@/components/ui/delivery-status-badge';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDateTime } from '@/lib/format';
import { useDigestRun } from '../api/get-digest-run';
import { DigestMessage } from './digest-message';

/** One past digest: who got it, how delivery went, and its content as it was generated. */
export function DigestRunDetail({ runId, onClose }: { runId: number; onClose: () => void }) {
  const run = useDigestRun(runId);
  if (run.isPending) return <LoadingState label="Loading the digest…" />;
  if (run.isError) return <ErrorState error={run.error} onRetry={() => void run.refetch()} />;
  const data = run.data;
  return (
    <section aria-label="Past digest" className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-base font-semibold">
          {data.kind === 'scheduled' ? 'Weekly digest' : 'Digest sent now'} of {formatDateTime(data.scheduledFor)}
        </h3>
        <Button variant="quiet" onClick={onClose}>
          ← All past digests
        </Button>
      </div>
      {data.recipients.length > 0 ? (
        <table className="w-full text-sm">
          <caption className="mb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-600">Recipients</caption>
          <tbody className="divide-y divide-paper-200">
            {data.recipients.map((recipient) => (
              <tr key={recipient.outboxMessageId}>
                <td className="py-1.5 pr-3">{recipient.name ?? '—'}</td>
                <td className="py-1.5 pr-3 font-mono text-xs text-ink-600">{recipient.email}</td>
                <td className="py-1.5 pr-3">
                  <DeliveryStatusBadge status={recipient.status} />
                </td>
                <td className="py-1.5 text-xs text-ink-500">{recipient.lastError ?? (recipient.sentAt ? formatDateTime(recipient.sentAt) : '')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-sm text-ink-600">Sent to {data.recipientCount} {data.recipientCount === 1 ? 'person' : 'people'}.</p>
      )}
      {data.html && data.text && data.subject ? (
        <DigestMessage subject={data.subject} html={data.html} text={data.text} />
      ) : (
        <p className="text-sm text-ink-600">This digest is still being prepared.</p>
      )}
    </section>
  );
}
