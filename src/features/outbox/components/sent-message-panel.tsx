import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDateTime } from '@/lib/format';
import { useSentMessage } from '../api/get-sent-message';
import { MessageView } from './message-view';
import { DeliveryStatusBadge } from '@/components/ui/delivery-status-badge';

/** One entry of the send log: its delivery state, attempts and last error, and what was sent. */
export function SentMessagePanel({ id }: { id: number }) {
  const message = useSentMessage(id);
  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) return <ErrorState error={message.error} onRetry={() => void message.refetch()} />;
  const data = message.data;
  return (
    <MessageView
      key={data.id}
      subject={data.subject}
      facts={[
        { label: 'Status', value: <DeliveryStatusBadge status={data.status} /> },
        { label: 'To', value: <span className="font-mono">{data.toName ? `${data.toName} <${data.to}>` : data.to}</span> },
        { label: 'From', value: data.from },
        { label: 'Queued', value: formatDateTime(data.createdAt) },
        { label: 'Sent', value: data.sentAt ? formatDateTime(data.sentAt) : '—' },
        { label: 'Attempts', value: String(data.attempts) },
        ...(data.nextAttemptAt && data.status === 'queued' ? [{ label: 'Next attempt', value: formatDateTime(data.nextAttemptAt) }] : []),
        ...(data.lastError ? [{ label: 'Last error', value: <span className="text-signal-danger">⚠ {data.lastError}</span> }] : []),
        ...(data.smtpResponse ? [{ label: 'Server said', value: <span className="font-mono text-xs">{data.smtpResponse}</span> }] : []),
      ]}
      html={data.html}
      text={data.text}
      headers={Object.entries(data.headers).map(([name, value]) => ({ name, value }))}
    />
  );
}
