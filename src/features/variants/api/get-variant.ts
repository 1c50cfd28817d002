import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VariantDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';

/** The prefix of every variant query (one variant, its comparison, any list), for invalidation after writes. */
export const variantsQueryKey = () => ['variants'] as const;

export const getVariant = (id: number) => api.get<VariantDto>(`/variants/${id}`);

export const getVariantQueryOptions = (id: number) =>
  queryOptions({ queryKey: [...variantsQueryKey(), id], queryFn: () => getVariant(id) });

export const useVariant = (id: number) => useQuery(getVariantQueryOptions(id));
