import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDateTime } from '@/lib/format';
import { useReceivedMessage } from '../api/get-received-message';
import { MessageView } from './message-view';

/** A message as the local fake SMTP server received it. */
export function ReceivedMessagePanel({ id }: { id: number }) {
  const message = useReceivedMessage(id);
  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) return <ErrorState error={message.error} onRetry={() => void message.refetch()} />;
  const data = message.data;
  return (
    <MessageView
      key={data.id}
      subject={data.subject}
      facts={[
        { label: 'From', value: data.from },
        { label: 'To', value: <span className="font-mono">{data.to.join(', ')}</span> },
        { label: 'Received', value: formatDateTime(data.receivedAt) },
        { label: 'Size', value: `${(data.sizeBytes / 1024).toFixed(1)} KiB` },
        { label: 'Message-ID', value: <span className="font-mono text-xs">{data.messageId ?? '—'}</span> },
      ]}
      html={data.html}
      text={data.text}
      headers={data.headers}
    />
  );
}
