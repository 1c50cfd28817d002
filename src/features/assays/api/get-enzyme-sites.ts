import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CatalyticSiteDto } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';

export const getEnzymeSites = (enzymeId: number) => api.get<{ rows: CatalyticSiteDto[]; total: number }>(`/enzymes/${enzymeId}/sites`);

export const getEnzymeSitesQueryOptions = (enzymeId: number) =>
  queryOptions({ queryKey: ['enzymes', enzymeId, 'sites'], queryFn: () => getEnzymeSites(enzymeId) });

export const useEnzymeSites = (enzymeId: number | null) => useQuery({ ...getEnzymeSitesQueryOptions(enzymeId ?? 0), enabled: enzymeId !== null });
