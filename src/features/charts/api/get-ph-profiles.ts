import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhProfileDto } from '@shared/schemas/ph-profile';
import { api } from '@/lib/api-client';

/** A variant's pH profiles, newest first. */
export const getPhProfiles = async (variantId: number) => (await api.get<{ items: PhProfileDto[] }>(`/ph-profiles?variantId=${variantId}`)).items;

export const getPhProfilesQueryOptions = (variantId: number) =>
  queryOptions({ queryKey: ['ph-profiles', { variantId }], queryFn: () => getPhProfiles(variantId) });

export const usePhProfiles = (variantId: number) => useQuery(getPhProfilesQueryOptions(variantId));
