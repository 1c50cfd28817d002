import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput, SessionUserDto } from '@shared/schemas/auth';
import { api, setCsrfToken } from '@/lib/api-client';

export async function changePassword(input: ChangePasswordInput): Promise<SessionUserDto> {
  const { user, csrfToken } = await api.post<{ user: SessionUserDto; csrfToken: string }>('/auth/password', input);
  setCsrfToken(csrfToken);
  return user;
}

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
