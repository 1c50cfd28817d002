import { useMutation } from '@tanstack/react-query';
import type { SessionUserDto } from '@shared/schemas/auth';
import type { AcceptInvitationInput } from '@shared/schemas/invitation';
import { api, setCsrfToken } from '@/lib/api-client';

/** Creates the account from the invitation; the server signs it in on this session and rotates the CSRF token. */
export async function acceptInvitation(input: AcceptInvitationInput): Promise<SessionUserDto> {
  const { user, csrfToken } = await api.post<{ user: SessionUserDto; csrfToken: string }>('/invitations/accept', input);
  setCsrfToken(csrfToken);
  return user;
}

export const useAcceptInvitation = () => useMutation({ mutationFn: acceptInvitation });
