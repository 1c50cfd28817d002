import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CampaignDto } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';

/** Campaigns to offer as the campaign of every row when a sheet has no campaign column. */
export const getImportCampaignChoices = async () => (await api.get<{ rows: CampaignDto[] }>('/campaigns')).rows;

export const getImportCampaignChoicesQueryOptions = () => queryOptions({ queryKey: ['imports', 'campaigns'], queryFn: getImportCampaignChoices });

export const useImportCampaignChoices = () => useQuery(getImportCampaignChoicesQueryOptions());
