import { ErrorState, LoadingState } from '@/components/ui/states';
import { useDigestPreview } from '../api/get-digest-preview';
import { DigestMessage } from './digest-message';

/** The next digest of a campaign as it would be sent to the signed-in user now. */
export function DigestPreviewPanel({ campaignId }: { campaignId: number }) {
  const preview = useDigestPreview(campaignId);
  if (preview.isPending) return <LoadingState label="Generating the preview…" />;
  if (preview.isError) return <ErrorState error={preview.error} onRetry={() => void preview.refetch()} />;
  const { content } = preview.data;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-600">
        As it would go out now to {preview.data.recipientCount} {preview.data.recipientCount === 1 ? 'person' : 'people'}: {content.rankedCount} ranked variant
        {content.rankedCount === 1 ? '' : 's'}, {content.awaitingReview.total} measurement{content.awaitingReview.total === 1 ? '' : 's'} waiting for review, {content.flags.total}{' '}
        flagged variant{content.flags.total === 1 ? '' : 's'}.
      </p>
      <DigestMessage subject={preview.data.subject} html={preview.data.html} text={preview.data.text} />
    </div>
  );
}
