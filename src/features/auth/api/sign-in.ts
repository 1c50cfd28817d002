import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionUserDto, SignInInput } from '@shared/schemas/auth';
import { api, setCsrfToken } from '@/lib/api-client';
import { getMeQueryOptions } from './get-me';

export async function signIn(input: SignInInput): Promise<SessionUserDto> {
  const { user, csrfToken } = await api.post<{ user: SessionUserDto; csrfToken: string }>('/auth/sign-in', input);
  setCsrfToken(csrfToken);
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // A different person may sign in on this tab: nothing cached for the last one may show.
      queryClient.clear();
      queryClient.setQueryData(getMeQueryOptions().queryKey, user);
    },
  });
}
