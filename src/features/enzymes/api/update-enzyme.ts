import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { EnzymeDto, updateEnzymeInput } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';
import { getEnzymeQueryOptions } from './get-enzyme';
import { getEnzymesQueryOptions } from './get-enzymes';

export const updateEnzyme = ({ id, ...changes }: z.input<typeof updateEnzymeInput> & { id: number }) =>
  api.patch<EnzymeDto>(`/enzymes/${id}`, changes);

export function useUpdateEnzyme() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateEnzyme,
    onSuccess: (enzyme) => {
      queryClient.setQueryData(getEnzymeQueryOptions(enzyme.id).queryKey, enzyme);
      return queryClient.invalidateQueries({ queryKey: getEnzymesQueryOptions().queryKey });
    },
  });
}
