import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DigestRunSummaryDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';
import { getDigestCampaignsQueryOptions } from './get-digest-campaigns';
import { getDigestPreviewQueryOptions } from './get-digest-preview';
import { getDigestRunsQueryOptions } from './get-digest-runs';

export const sendDigest = async (campaignId: number) => (await api.post<{ run: DigestRunSummaryDto }>(`/digests/campaigns/${campaignId}/send`)).run;

export function useSendDigest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendDigest,
    onSuccess: (_run, campaignId) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getDigestCampaignsQueryOptions().queryKey }),
        // Every page of the run list (the key without its page).
        queryClient.invalidateQueries({ queryKey: getDigestRunsQueryOptions(campaignId, 1).queryKey.slice(0, 2) }),
        queryClient.invalidateQueries({ queryKey: getDigestPreviewQueryOptions(campaignId).queryKey }),
      ]),
  });
}
