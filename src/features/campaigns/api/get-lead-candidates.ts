import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PersonRefDto } from '@shared/schemas/campaign';
import { api } from '@/lib/api-client';

/** Active leads and admins, who may lead a campaign (readable by those who manage campaigns). */
export const getLeadCandidates = async () => (await api.get<{ rows: PersonRefDto[] }>('/campaigns/lead-candidates')).rows;

export const getLeadCandidatesQueryOptions = () =>
  queryOptions({ queryKey: ['campaigns', 'lead-candidates'], queryFn: getLeadCandidates, staleTime: 5 * 60_000 });

export const useLeadCandidates = (enabled: boolean) => useQuery({ ...getLeadCandidatesQueryOptions(), enabled });
