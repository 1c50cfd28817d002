import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ListVariantsParams, VariantListDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';

/** Variants to choose from: a campaign's, matching the search text, by label. */
export function getVariantOptions(params: ListVariantsParams): Promise<VariantListDto> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== '') search.set(key, String(value));
  }
  return api.get<VariantListDto>(`/variants?${search.toString()}`);
}

export const getVariantOptionsQueryOptions = (params: ListVariantsParams) =>
  queryOptions({ queryKey: ['variants', 'list', params], queryFn: () => getVariantOptions(params) });

export const useVariantOptions = (campaignId: number | null, q: string) =>
  useQuery({
    ...getVariantOptionsQueryOptions({ campaignId: campaignId ?? undefined, q: q.trim() || undefined, sort: 'label', pageSize: 200 }),
    enabled: campaignId !== null,
    placeholderData: keepPreviousData,
  });
