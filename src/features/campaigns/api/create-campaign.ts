import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { CampaignDto, createCampaignInput } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';
import { getCampaignsQueryOptions } from './get-campaigns';

export const createCampaign = (input: z.input<typeof createCampaignInput>) => api.post<CampaignDto>('/campaigns', input);

export function useCreateCampaign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCampaign,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getCampaignsQueryOptions().queryKey }),
  });
}
