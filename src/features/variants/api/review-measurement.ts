import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeasurementDto, ReviewAction } from '@shared/schemas/measurement';
import { api } from '@/lib/api-client';
import { getCampaignCyclesQueryOptions } from './get-campaign-cycles';
import { variantsQueryKey } from './get-variant';
import { measurementsQueryKey } from './get-variant-measurements';

export interface ReviewMeasurementVariables {
  id: number;
  version: number;
  action: ReviewAction;
  reason?: string | null;
}

export const reviewMeasurement = async ({ id, ...review }: ReviewMeasurementVariables) =>
  (await api.post<{ measurement: MeasurementDto }>(`/measurements/${id}/review`, review)).measurement;

export function useReviewMeasurement() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reviewMeasurement,
    // A flag takes the measurement out of the comparisons, the summaries and the cycles.
    onSuccess: (measurement) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: measurementsQueryKey() }),
        queryClient.invalidateQueries({ queryKey: variantsQueryKey() }),
        queryClient.invalidateQueries({ queryKey: getCampaignCyclesQueryOptions(measurement.variant.campaignId).queryKey }),
      ]),
  });
}
