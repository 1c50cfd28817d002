import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnsubscribeLookupDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';
import { getUnsubscribeQueryOptions } from './get-unsubscribe';

export const unsubscribe = async (token: string) => (await api.post<{ unsubscribe: UnsubscribeLookupDto }>('/digests/unsubscribe', { token })).unsubscribe;

export function useUnsubscribe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: unsubscribe,
    onSuccess: (result, token) => queryClient.setQueryData(getUnsubscribeQueryOptions(token).queryKey, result),
  });
}
