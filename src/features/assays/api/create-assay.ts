import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { AssayDto, CreateAssayInput } from '@shared/schemas/assay';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { api } from '@/lib/api-client';

export const createAssay = (input: CreateAssayInput) => api.post<{ assay: AssayDto; measurement: MeasurementDto }>('/assays', input);

/** A new measurement changes the variant's summary, its campaign's rankings and every list that shows them. */
export function invalidateAfterMeasurement(queryClient: QueryClient): Promise<unknown> {
  return Promise.all(
    ['variants', 'assays', 'measurements', 'campaigns', 'ph-profiles', 'overview'].map((root) => queryClient.invalidateQueries({ queryKey: [root] })),
  );
}

export function useCreateAssay() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createAssay, onSuccess: () => invalidateAfterMeasurement(queryClient) });
}
