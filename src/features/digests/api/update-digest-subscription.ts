import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DigestSubscriptionStateDto, UpdateDigestSubscriptionInput } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';
import { getDigestCampaignsQueryOptions } from './get-digest-campaigns';
import { getDigestPreviewQueryOptions } from './get-digest-preview';
import { getDigestSubscribersQueryOptions } from './get-digest-subscribers';

export const updateDigestSubscription = async ({ campaignId, ...input }: UpdateDigestSubscriptionInput & { campaignId: number }) =>
  (await api.put<{ subscription: DigestSubscriptionStateDto }>(`/digests/campaigns/${campaignId}/subscription`, input)).subscription;

export function useUpdateDigestSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDigestSubscription,
    onSettled: (_data, _error, { campaignId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getDigestCampaignsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: getDigestSubscribersQueryOptions(campaignId).queryKey }),
        queryClient.invalidateQueries({ queryKey: getDigestPreviewQueryOptions(campaignId).queryKey }),
      ]),
  });
}
