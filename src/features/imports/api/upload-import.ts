import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportJobDto, ImportKind } from '@shared/schemas/import';
import { api } from '@/lib/api-client';
import { getImportJobQueryOptions } from './get-import-job';
import { getImportJobsQueryOptions } from './get-import-jobs';

/** Uploads a workbook or CSV file for one kind of import; the server checks it and lists its sheets. */
export const uploadImport = async ({ kind, file }: { kind: ImportKind; file: File }) => {
  const form = new FormData();
  form.append('kind', kind);
  form.append('file', file);
  return (await api.postForm<{ job: ImportJobDto }>('/imports', form)).job;
};

export function useUploadImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadImport,
    onSuccess: (job) => {
      queryClient.setQueryData(getImportJobQueryOptions(job.id).queryKey, job);
      void queryClient.invalidateQueries({ queryKey: getImportJobsQueryOptions().queryKey });
    },
  });
}
