import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationDto } from '@shared/schemas/invitation';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

export const revokeInvitation = async ({ id, version }: { id: number; version: number }) =>
  (await api.post<{ invitation: InvitationDto }>(`/invitations/${id}/revoke`, { version })).invitation;

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions().queryKey }),
  });
}
