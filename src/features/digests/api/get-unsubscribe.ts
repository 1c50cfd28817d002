import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnsubscribeLookupDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';

export const getUnsubscribe = async (token: string) =>
  (await api.get<{ unsubscribe: UnsubscribeLookupDto }>(`/digests/unsubscribe?token=${encodeURIComponent(token)}`)).unsubscribe;

export const getUnsubscribeQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['digests', 'unsubscribe', token], queryFn: () => getUnsubscribe(token), staleTime: Infinity });

export const useUnsubscribeLookup = (token: string) => useQuery(getUnsubscribeQueryOptions(token));
