import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationLookupDto } from '@shared/schemas/invitation';
import { api } from '@/lib/api-client';

/** What an invitation link is for; a link that no longer works answers 400 `invalid_token`. */
export const getInvitation = async (token: string) =>
  (await api.get<{ invitation: InvitationLookupDto }>(`/invitations/lookup?token=${encodeURIComponent(token)}`)).invitation;

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['invitations', 'lookup', token], queryFn: () => getInvitation(token), staleTime: Infinity });

export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));
