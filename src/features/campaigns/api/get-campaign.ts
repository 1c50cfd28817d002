import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignDto } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';

export const getCampaign = (id: number) => api.get<CampaignDto>(`/campaigns/${id}`);

export const getCampaignQueryOptions = (id: number) => queryOptions({ queryKey: ['campaigns', id], queryFn: () => getCampaign(id) });

export const useCampaign = (id: number) => useQuery(getCampaignQueryOptions(id));
