import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { createVariantInput, VariantDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';
import { getVariantQueryOptions, variantsQueryKey } from './get-variant';

export const createVariant = (input: z.input<typeof createVariantInput>) => api.post<VariantDto>('/variants', input);

export function useCreateVariant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVariant,
    onSuccess: async (variant) => {
      await queryClient.invalidateQueries({ queryKey: variantsQueryKey() });
      queryClient.setQueryData(getVariantQueryOptions(variant.id).queryKey, variant);
    },
  });
}
