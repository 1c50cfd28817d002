import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AssayDto } from '@shared/schemas/assay';
import { api } from '@/lib/api-client';

/** A variant's assays, newest first, without their points. */
export const getVariantAssays = (variantId: number) =>
  api.get<{ items: AssayDto[]; total: number }>(`/assays?variantId=${variantId}&pageSize=100`);

export const getVariantAssaysQueryOptions = (variantId: number) =>
  queryOptions({ queryKey: ['assays', { variantId }], queryFn: () => getVariantAssays(variantId) });

export const useVariantAssays = (variantId: number) => useQuery(getVariantAssaysQueryOptions(variantId));
