import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListVariantsParams, VariantListDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';
import { variantsQueryKey } from './get-variant';

export function getVariants(params: ListVariantsParams): Promise<VariantListDto> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, Array.isArray(value) ? value.join(',') : String(value));
  }
  return api.get<VariantListDto>(`/variants?${search.toString()}`);
}

export const getVariantsQueryOptions = (params: ListVariantsParams) =>
  queryOptions({ queryKey: [...variantsQueryKey(), 'list', params], queryFn: () => getVariants(params) });

export const useVariants = (params: ListVariantsParams, enabled = true) => useQuery({ ...getVariantsQueryOptions(params), enabled });
