import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AttachmentDto } from '@shared/schemas/attachment';
import { api } from '@/lib/api-client';

export const getAssayFiles = async (assayId: number) => (await api.get<{ attachments: AttachmentDto[] }>(`/assays/${assayId}/attachments`)).attachments;

export const getAssayFilesQueryOptions = (assayId: number) =>
  queryOptions({ queryKey: ['assays', assayId, 'attachments'], queryFn: () => getAssayFiles(assayId) });

export const useAssayFiles = (assayId: number | null) => useQuery({ ...getAssayFilesQueryOptions(assayId ?? 0), enabled: assayId !== null });
