import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { updateVariantInput, VariantDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';
import { getVariantQueryOptions, variantsQueryKey } from './get-variant';

export const updateVariant = ({ id, ...changes }: z.input<typeof updateVariantInput> & { id: number }) =>
  api.patch<VariantDto>(`/variants/${id}`, changes);

export function useUpdateVariant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateVariant,
    onSuccess: async (variant) => {
      queryClient.setQueryData(getVariantQueryOptions(variant.id).queryKey, variant);
      // Lists and other variants' lineage show this one's label and status.
      await queryClient.invalidateQueries({
        queryKey: variantsQueryKey(),
        predicate: (query) => query.queryKey[1] !== variant.id,
      });
    },
  });
}
