import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportJobDto, PreviewImportInput } from '@shared/schemas/import';
import { api } from '@/lib/api-client';
import { getImportJobQueryOptions } from './get-import-job';

/** Starts checking every row with a sheet and column mapping; the job then reports progress and results. */
export const previewImport = async ({ id, ...input }: PreviewImportInput & { id: number }) =>
  (await api.post<{ job: ImportJobDto }>(`/imports/${id}/preview`, input)).job;

export function usePreviewImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: previewImport,
    onSuccess: (job) => queryClient.setQueryData(getImportJobQueryOptions(job.id).queryKey, job),
  });
}
