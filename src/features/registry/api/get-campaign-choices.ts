import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignDto } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';

/** The campaigns a registry view can be narrowed to. */
export const getCampaignChoices = async () => (await api.get<{ rows: CampaignDto[] }>('/campaigns')).rows;

export const getCampaignChoicesQueryOptions = () => queryOptions({ queryKey: ['campaigns', 'choices'], queryFn: getCampaignChoices });

export const useCampaignChoices = () => useQuery(getCampaignChoicesQueryOptions());
