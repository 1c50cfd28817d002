import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationDto } from '@shared/schemas/invitation';
import { api } from '@/lib/api-client';

export const getInvitations = async () => (await api.get<{ invitations: InvitationDto[] }>('/invitations')).invitations;

export const getInvitationsQueryOptions = () => queryOptions({ queryKey: ['invitations'], queryFn: getInvitations });

export const useInvitations = () => useQuery(getInvitationsQueryOptions());
