import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DigestSubscriberDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';

export const getDigestSubscribers = async (campaignId: number) =>
  (await api.get<{ subscribers: DigestSubscriberDto[] }>(`/digests/campaigns/${campaignId}/subscribers`)).subscribers;

export const getDigestSubscribersQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: ['digests', 'subscribers', campaignId], queryFn: () => getDigestSubscribers(campaignId) });

export const useDigestSubscribers = (campaignId: number, enabled: boolean) => useQuery({ ...getDigestSubscribersQueryOptions(campaignId), enabled });
