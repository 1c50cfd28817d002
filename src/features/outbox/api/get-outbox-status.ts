import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxStatusDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const getOutboxStatus = () => api.get<OutboxStatusDto>('/outbox');

export const getOutboxStatusQueryOptions = () => queryOptions({ queryKey: ['outbox', 'status'], queryFn: getOutboxStatus, staleTime: 5_000, refetchInterval: 5_000 });

export const useOutboxStatus = () => useQuery(getOutboxStatusQueryOptions());
