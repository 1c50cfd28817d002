import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EnzymeDto } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';

export const getEnzyme = (id: number) => api.get<EnzymeDto>(`/enzymes/${id}`);

export const getEnzymeQueryOptions = (id: number) => queryOptions({ queryKey: ['enzymes', id], queryFn: () => getEnzyme(id) });

/** One enzyme with its sequence and sites; `id` undefined waits (e.g. until a campaign is chosen). */
export const useEnzyme = (id: number | undefined) =>
  useQuery({ ...getEnzymeQueryOptions(id ?? 0), enabled: id !== undefined && id > 0 });
