import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VariantComparisonDto } from '@shared/schemas/comparison';
import { api } from '@/lib/api-client';

export const getVariantComparison = (id: number) => api.get<VariantComparisonDto>(`/variants/${id}/comparison`);

export const getVariantComparisonQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['variants', id, 'comparison'], queryFn: () => getVariantComparison(id) });

export const useVariantComparison = (id: number) => useQuery(getVariantComparisonQueryOptions(id));
