import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DigestCampaignListDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';

export const getDigestCampaigns = () => api.get<DigestCampaignListDto>('/digests/campaigns');

export const getDigestCampaignsQueryOptions = () => queryOptions({ queryKey: ['digests', 'campaigns'], queryFn: getDigestCampaigns });

export const useDigestCampaigns = () => useQuery(getDigestCampaignsQueryOptions());
