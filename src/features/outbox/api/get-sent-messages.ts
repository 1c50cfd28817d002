import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxMessageSummaryDto, OutboxStatus, PageDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export interface SentMessagesFilter {
  page: number;
  status?: OutboxStatus;
}

export const getSentMessages = ({ page, status }: SentMessagesFilter) =>
  api.get<PageDto<OutboxMessageSummaryDto>>(`/outbox/messages?page=${page}&pageSize=50${status ? `&status=${status}` : ''}`);

export const getSentMessagesQueryOptions = (filter: SentMessagesFilter) =>
  queryOptions({ queryKey: ['outbox', 'messages', filter], queryFn: () => getSentMessages(filter), staleTime: 5_000, refetchInterval: 5_000, placeholderData: keepPreviousData });

export const useSentMessages = (filter: SentMessagesFilter) => useQuery(getSentMessagesQueryOptions(filter));
