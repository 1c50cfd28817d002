import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VariantDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';

export const getVariant = (id: number) => api.get<VariantDto>(`/variants/${id}`);

export const getVariantQueryOptions = (id: number) => queryOptions({ queryKey: ['variants', id], queryFn: () => getVariant(id) });

export const useVariant = (id: number | null) => useQuery({ ...getVariantQueryOptions(id ?? 0), enabled: id !== null });
