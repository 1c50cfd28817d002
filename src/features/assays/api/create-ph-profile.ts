import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePhProfileInput, PhProfileDto } from '@shared/schemas/ph-profile';
import { api } from '@/lib/api-client';
import { invalidateAfterMeasurement } from './create-assay';

export const createPhProfile = async (input: CreatePhProfileInput) => (await api.post<{ profile: PhProfileDto }>('/ph-profiles', input)).profile;

export function useCreatePhProfile() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPhProfile, onSuccess: () => invalidateAfterMeasurement(queryClient) });
}
