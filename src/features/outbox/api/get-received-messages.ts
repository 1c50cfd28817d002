import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PageDto, ReceivedMessageSummaryDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const getReceivedMessages = (page: number) => api.get<PageDto<ReceivedMessageSummaryDto>>(`/outbox/received?page=${page}&pageSize=50`);

export const getReceivedMessagesQueryOptions = (page: number) =>
  queryOptions({ queryKey: ['outbox', 'received', { page }], queryFn: () => getReceivedMessages(page), staleTime: 5_000, refetchInterval: 5_000, placeholderData: keepPreviousData });

export const useReceivedMessages = (page: number) => useQuery(getReceivedMessagesQueryOptions(page));
