import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { createEnzymeInput, EnzymeDto } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';
import { getEnzymesQueryOptions } from './get-enzymes';

export const createEnzyme = (input: z.input<typeof createEnzymeInput>) => api.post<EnzymeDto>('/enzymes', input);

export function useCreateEnzyme() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createEnzyme,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getEnzymesQueryOptions().queryKey }),
  });
}
