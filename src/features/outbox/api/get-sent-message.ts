import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxMessageDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const getSentMessage = async (id: number) => (await api.get<{ message: OutboxMessageDto }>(`/outbox/messages/${id}`)).message;

export const getSentMessageQueryOptions = (id: number) => queryOptions({ queryKey: ['outbox', 'messages', id], queryFn: () => getSentMessage(id), staleTime: 5_000 });

export const useSentMessage = (id: number | null) => useQuery({ ...getSentMessageQueryOptions(id ?? 0), enabled: id !== null });
