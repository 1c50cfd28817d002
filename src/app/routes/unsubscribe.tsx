import { Link, useSearchParams } from 'react-router-dom';
import { PublicPage } from '@/components/layout/public-page';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useUnsubscribeLookup } from '@/features/digests/api/get-unsubscribe';
import { useUnsubscribe } from '@/features/digests/api/unsubscribe';

export default function UnsubscribeRoute() {
  const [search] = useSearchParams();
  const token = search.get('token') ?? '';
  const lookup = useUnsubscribeLookup(token);
  const unsubscribe = useUnsubscribe();

  return (
    <PublicPage title="Weekly digest">
      {lookup.isPending && <LoadingState label="Checking the link…" />}
      {lookup.isError && (
        <Notice tone="danger" title="This link cannot be used">
          {lookup.error.message}
        </Notice>
      )}
      {lookup.data && lookup.data.subscribed && (
        <>
          <p className="text-sm text-ink-700">
            Stop sending the weekly ranking of <strong>{lookup.data.campaign.name}</strong> to <span className="font-mono">{lookup.data.email}</span>?
          </p>
          {unsubscribe.isError && <Notice tone="danger" title={unsubscribe.error.message} />}
          <Button variant="primary" busy={unsubscribe.isPending} onClick={() => unsubscribe.mutate(token)}>
            Unsubscribe
          </Button>
        </>
      )}
      {lookup.data && !lookup.data.subscribed && (
        <Notice tone="fine" title="You are unsubscribed.">
          {lookup.data.email} no longer receives the weekly ranking of {lookup.data.campaign.name}. You can subscribe again on the Digests page.
        </Notice>
      )}
      <p className="text-sm">
        <Link to={paths.digests.href()} className="text-lagoon-700 underline">
          Manage your subscriptions
        </Link>
      </p>
    </PublicPage>
  );
}
