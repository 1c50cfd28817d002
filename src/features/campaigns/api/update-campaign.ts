import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { CampaignDto, updateCampaignInput } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';
import { getCampaignActivityQueryOptions } from './get-campaign-activity';
import { getCampaignQueryOptions } from './get-campaign';
import { getCampaignsQueryOptions } from './get-campaigns';

export const updateCampaign = ({ id, ...changes }: z.input<typeof updateCampaignInput> & { id: number }) =>
  api.patch<CampaignDto>(`/campaigns/${id}`, changes);

export function useUpdateCampaign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCampaign,
    onSuccess: (campaign) => {
      queryClient.setQueryData(getCampaignQueryOptions(campaign.id).queryKey, campaign);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: getCampaignsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: getCampaignActivityQueryOptions(campaign.id).queryKey }),
      ]);
    },
  });
}
