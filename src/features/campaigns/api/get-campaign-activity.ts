import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxAuditPageSize, type AuditListDto } from '@shared/schemas/audit';
import { api } from '@/lib/api-client';

/** The campaign's latest changes from the audit trail, newest first (one page of the longest size). */
export const getCampaignActivity = (campaignId: number) =>
  api.get<AuditListDto>(`/audit?campaignId=${campaignId}&pageSize=${maxAuditPageSize}`);

export const getCampaignActivityQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['audit', { campaignId }], queryFn: () => getCampaignActivity(campaignId) });

export const useCampaignActivity = (campaignId: number) => useQuery(getCampaignActivityQueryOptions(campaignId));
