import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { CatalyticSiteDto, createCatalyticSiteInput } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';
import { getEnzymeQueryOptions } from './get-enzyme';
import { getEnzymesQueryOptions } from './get-enzymes';

export const addSite = ({ enzymeId, ...site }: z.input<typeof createCatalyticSiteInput> & { enzymeId: number }) =>
  api.post<CatalyticSiteDto>(`/enzymes/${enzymeId}/sites`, site);

export function useAddSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addSite,
    onSuccess: (site) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getEnzymeQueryOptions(site.enzymeId).queryKey }),
        queryClient.invalidateQueries({ queryKey: getEnzymesQueryOptions().queryKey }),
      ]),
  });
}
