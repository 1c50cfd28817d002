import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { api } from '@/lib/api-client';

/** The prefix of every measurement query, for invalidation after a review. */
export const measurementsQueryKey = () => ['measurements'] as const;

// A variant rarely has more than a few dozen measurements; 500 is the API's longest page.
const measurementsPerVariant = 500;

/** Every measurement of a variant (all review states, refits included), newest first. */
export const getVariantMeasurements = async (variantId: number) =>
  (await api.get<{ items: MeasurementDto[]; total: number }>(`/measurements?variantId=${variantId}&pageSize=${measurementsPerVariant}`)).items;

export const getVariantMeasurementsQueryOptions = (variantId: number) =>
  queryOptions({ queryKey: [...measurementsQueryKey(), { variantId }], queryFn: () => getVariantMeasurements(variantId) });

export const useVariantMeasurements = (variantId: number | undefined) =>
  useQuery({ ...getVariantMeasurementsQueryOptions(variantId ?? 0), enabled: variantId !== undefined });
