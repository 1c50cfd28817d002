import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignCyclesDto } from '@shared/schemas/comparison';
import { api } from '@/lib/api-client';

export const getCampaignCycles = (campaignId: number) => api.get<CampaignCyclesDto>(`/campaigns/${campaignId}/cycles`);

export const getCampaignCyclesQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['campaigns', campaignId, 'cycles'], queryFn: () => getCampaignCycles(campaignId) });

export const useCampaignCycles = (campaignId: number | undefined) =>
  useQuery({ ...getCampaignCyclesQueryOptions(campaignId ?? 0), enabled: campaignId !== undefined });
