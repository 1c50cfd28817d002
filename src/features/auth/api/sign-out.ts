import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '@/lib/api-client';
import { getMeQueryOptions } from './get-me';

export async function signOut(): Promise<void> {
  await api.post<void>('/auth/sign-out');
  setCsrfToken(null);
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(getMeQueryOptions().queryKey, null);
    },
  });
}
