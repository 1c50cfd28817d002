import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReceivedMessageDto } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const getReceivedMessage = async (id: number) => (await api.get<{ message: ReceivedMessageDto }>(`/outbox/received/${id}`)).message;

export const getReceivedMessageQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['outbox', 'received', id], queryFn: () => getReceivedMessage(id), staleTime: Infinity });

export const useReceivedMessage = (id: number | null) => useQuery({ ...getReceivedMessageQueryOptions(id ?? 0), enabled: id !== null });
