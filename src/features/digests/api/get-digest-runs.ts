import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DigestRunSummaryDto } from '@shared/schemas/digest';
import type { PageDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const getDigestRuns = (campaignId: number, page: number) =>
  api.get<PageDto<DigestRunSummaryDto>>(`/digests/runs?campaignId=${campaignId}&page=${page}&pageSize=20`);

export const getDigestRunsQueryOptions = (campaignId: number, page: number) =>
  queryOptions({ queryKey: ['digests', 'runs', { campaignId, page }], queryFn: () => getDigestRuns(campaignId, page), placeholderData: keepPreviousData });

export const useDigestRuns = (campaignId: number, page: number) => useQuery(getDigestRunsQueryOptions(campaignId, page));
