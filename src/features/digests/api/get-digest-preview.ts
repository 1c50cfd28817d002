import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DigestPreviewDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';

export const getDigestPreview = (campaignId: number) => api.get<DigestPreviewDto>(`/digests/campaigns/${campaignId}/preview`);

export const getDigestPreviewQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['digests', 'preview', campaignId], queryFn: () => getDigestPreview(campaignId) });

export const useDigestPreview = (campaignId: number) => useQuery(getDigestPreviewQueryOptions(campaignId));
