import { useMutation } from '@tanstack/react-query';
import type { SessionUserDto } from '@shared/schemas/auth';
import type { CompletePasswordResetInput } from '@shared/schemas/password-reset';
import { api, setCsrfToken } from '@/lib/api-client';

/** Sets the new password; the server ends every other session, signs the user in here and rotates the CSRF token. */
export async function completePasswordReset(input: CompletePasswordResetInput): Promise<SessionUserDto> {
  const { user, csrfToken } = await api.post<{ user: SessionUserDto; csrfToken: string }>('/password-resets/complete', input);
  setCsrfToken(csrfToken);
  return user;
}

export const useCompletePasswordReset = () => useMutation({ mutationFn: completePasswordReset });
