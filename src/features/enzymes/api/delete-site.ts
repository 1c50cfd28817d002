import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getEnzymeQueryOptions } from './get-enzyme';
import { getEnzymesQueryOptions } from './get-enzymes';

export const deleteSite = ({ enzymeId, siteId }: { enzymeId: number; siteId: number }) =>
  api.delete<void>(`/enzymes/${enzymeId}/sites/${siteId}`);

export function useDeleteSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSite,
    onSuccess: (_result, { enzymeId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getEnzymeQueryOptions(enzymeId).queryKey }),
        queryClient.invalidateQueries({ queryKey: getEnzymesQueryOptions().queryKey }),
      ]),
  });
}
