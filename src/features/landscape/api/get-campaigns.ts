import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignDto } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';

export const getCampaigns = () => api.get<{ rows: CampaignDto[]; total: number }>('/campaigns');

export const getCampaignsQueryOptions = () => queryOptions({ queryKey: ['campaigns', 'list'], queryFn: getCampaigns });

export const useCampaigns = () => useQuery(getCampaignsQueryOptions());
