import type { QueryClient } from '@tanstack/react-query';
import { parseRegistryView, registryBlockSize, variantListParams } from '../registry-view';
import { getCampaignChoicesQueryOptions } from './get-campaign-choices';
import { getVariantPageQueryOptions } from './get-variant-page';

/**
 * Asks for what the registry's first screen shows, for the view in an address: the grid's first block
 * (under the key the grid's datasource reads, so the grid finds it cached) and the campaign choices.
 * Fresh results are not asked for again.
 */
export function prefetchRegistry(queryClient: QueryClient, search: URLSearchParams): Promise<void> {
  const { view } = parseRegistryView(search);
  return Promise.all([
    queryClient.prefetchQuery(getVariantPageQueryOptions(variantListParams(view.filters, view.sort, 1, registryBlockSize))),
    queryClient.prefetchQuery(getCampaignChoicesQueryOptions()),
  ]).then(() => undefined);
}
