import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignLandscapeDto } from '@shared/schemas/comparison';
import { api } from '@/lib/api-client';

export const getCampaignLandscape = (campaignId: number) => api.get<CampaignLandscapeDto>(`/campaigns/${campaignId}/landscape`);

export const getCampaignLandscapeQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['campaigns', campaignId, 'landscape'], queryFn: () => getCampaignLandscape(campaignId) });

export const useCampaignLandscape = (campaignId: number | undefined) =>
  useQuery({ ...getCampaignLandscapeQueryOptions(campaignId ?? 0), enabled: campaignId !== undefined });
