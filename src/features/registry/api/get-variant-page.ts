import { queryOptions } from '@tanstack/react-query';
import type { VariantListDto } from '@shared/schemas/variant';
import { api } from '@/lib/api-client';

/** One page of the variant list; `params` are the list API's query parameters (see registry-view.ts). */
export const getVariantPage = (params: Readonly<Record<string, string>>) =>
  api.get<VariantListDto>(`/variants?${new URLSearchParams(params).toString()}`);

// Under the 'variants' key so that whatever invalidates variants (a registration, a review) refreshes the grid.
export const getVariantPageQueryOptions = (params: Readonly<Record<string, string>>) =>
  queryOptions({ queryKey: ['variants', 'registry-page', params], queryFn: () => getVariantPage(params) });
