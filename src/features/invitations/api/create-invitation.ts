import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationInput, InvitationDto } from '@shared/schemas/invitation';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

export const createInvitation = async (input: CreateInvitationInput) => (await api.post<{ invitation: InvitationDto }>('/invitations', input)).invitation;

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions().queryKey }),
  });
}
