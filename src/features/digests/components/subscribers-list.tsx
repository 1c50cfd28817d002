import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useDigestSubscribers } from '../api/get-digest-subscribers';

/** Who receives a campaign's digest (for leads and admins). */
export function SubscribersList({ campaignId }: { campaignId: number }) {
  const subscribers = useDigestSubscribers(campaignId, true);
  if (subscribers.isPending) return <LoadingState label="Loading subscribers…" />;
  if (subscribers.isError) return <ErrorState error={subscribers.error} onRetry={() => void subscribers.refetch()} />;
  if (subscribers.data.length === 0) return <EmptyState title="Nobody receives this digest." />;
  return (
    <ul aria-label="Recipients" className="divide-y divide-paper-200 text-sm">
      {subscribers.data.map((subscriber) => (
        <li key={subscriber.userId} className="flex justify-between gap-3 py-1.5">
          <span>
            {subscriber.name}
            {subscriber.byDefault && <span className="text-ink-500"> (lead, by default)</span>}
          </span>
          <span className="font-mono text-xs text-ink-500">{subscriber.email}</span>
        </li>
      ))}
    </ul>
  );
}
