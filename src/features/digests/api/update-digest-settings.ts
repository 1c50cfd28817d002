import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DigestSettingsDto, UpdateDigestSettingsInput } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';
import { getDigestCampaignsQueryOptions } from './get-digest-campaigns';
import { getDigestPreviewQueryOptions } from './get-digest-preview';

export const updateDigestSettings = async ({ campaignId, ...input }: UpdateDigestSettingsInput & { campaignId: number }) =>
  (await api.put<{ settings: DigestSettingsDto }>(`/digests/campaigns/${campaignId}/settings`, input)).settings;

export function useUpdateDigestSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDigestSettings,
    onSettled: (_data, _error, { campaignId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getDigestCampaignsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: getDigestPreviewQueryOptions(campaignId).queryKey }),
      ]),
  });
}
