import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportJobDto, ImportMode } from '@shared/schemas/import';
import { api } from '@/lib/api-client';
import { getImportJobQueryOptions } from './get-import-job';
import { getImportJobsQueryOptions } from './get-import-jobs';

/** Starts writing the previewed rows: all or nothing, or only the valid ones. */
export const commitImport = async ({ id, version, mode }: { id: number; version: number; mode: ImportMode }) =>
  (await api.post<{ job: ImportJobDto }>(`/imports/${id}/commit`, { version, mode })).job;

export function useCommitImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: commitImport,
    onSuccess: (job) => {
      queryClient.setQueryData(getImportJobQueryOptions(job.id).queryKey, job);
      void queryClient.invalidateQueries({ queryKey: getImportJobsQueryOptions().queryKey });
    },
  });
}
