import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignCyclesDto } from '@shared/schemas/comparison';
import { api } from '@/lib/api-client';

export const getCampaignCycles = (campaignId: number) => api.get<CampaignCyclesDto>(`/campaigns/${campaignId}/cycles`);

export const getCampaignCyclesQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['campaigns', campaignId, 'cycles'], queryFn: () => getCampaignCycles(campaignId) });

/** `enabled` lets the page hold the cycles back until its first chart is drawn. */
export const useCampaignCycles = (campaignId: number | undefined, enabled = true) =>
  useQuery({ ...getCampaignCyclesQueryOptions(campaignId ?? 0), enabled: enabled && campaignId !== undefined });
