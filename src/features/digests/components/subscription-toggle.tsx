import type { DigestCampaignDto } from '@shared/schemas/digest';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useUpdateDigestSubscription } from '../api/update-digest-subscription';

/** The signed-in user's own subscription to a campaign's digest. */
export function SubscriptionToggle({ entry }: { entry: DigestCampaignDto }) {
  const update = useUpdateDigestSubscription();
  const { subscription } = entry;
  const failure = update.error instanceof ApiError ? update.error : null;
  const handleToggle = () => update.mutate({ campaignId: entry.campaign.id, subscribed: !subscription.subscribed, version: subscription.version });

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm">
          {subscription.subscribed ? (
            <>
              <span aria-hidden>✓ </span>You receive this digest{subscription.byDefault ? ' as the campaign lead' : ''}.
            </>
          ) : (
            <span className="text-ink-600">You do not receive this digest.</span>
          )}
        </p>
        <Button variant={subscription.subscribed ? 'secondary' : 'primary'} busy={update.isPending} onClick={handleToggle}>
          {subscription.subscribed ? 'Unsubscribe' : 'Subscribe'}
        </Button>
      </div>
      {failure && (
        <Notice tone="danger" title={failure.code === 'stale_version' ? 'Your subscription changed elsewhere' : 'The change was refused'}>
          {failure.message}
        </Notice>
      )}
    </div>
  );
}
