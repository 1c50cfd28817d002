import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { bulkReviewInput, MeasurementDto } from '@shared/schemas/measurement';
import { api } from '@/lib/api-client';

export type ReviewMeasurementsInput = z.input<typeof bulkReviewInput>;

/** Approves or flags several measurements at once; the server changes all of them or none. */
export const reviewMeasurements = async (input: ReviewMeasurementsInput) =>
  (await api.post<{ items: MeasurementDto[] }>('/measurements/review', input)).items;

export function useReviewMeasurements() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reviewMeasurements,
    // A review changes which measurements count, and so the summaries, rankings and counts on every page.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
