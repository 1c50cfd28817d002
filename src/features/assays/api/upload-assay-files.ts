import { useMutation, useQueryClient } from '@tanstack/react-query';
import { attachmentField, type AttachmentDto } from '@shared/schemas/attachment';
import { api } from '@/lib/api-client';
import { getAssayFilesQueryOptions } from './get-assay-files';

export async function uploadAssayFiles({ assayId, files }: { assayId: number; files: readonly File[] }): Promise<AttachmentDto[]> {
  const form = new FormData();
  for (const file of files) form.append(attachmentField, file, file.name);
  return (await api.postForm<{ attachments: AttachmentDto[] }>(`/assays/${assayId}/attachments`, form)).attachments;
}

export function useUploadAssayFiles() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadAssayFiles,
    onSuccess: (_attachments, { assayId }) => queryClient.invalidateQueries({ queryKey: getAssayFilesQueryOptions(assayId).queryKey }),
  });
}
