import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AssayDto } from '@shared/schemas/assay';
import { api } from '@/lib/api-client';

/** One assay with its rate points and measurements. */
export const getAssay = async (id: number) => (await api.get<{ assay: AssayDto }>(`/assays/${id}`)).assay;

export const getAssayQueryOptions = (id: number) => queryOptions({ queryKey: ['assays', id], queryFn: () => getAssay(id) });

export const useAssay = (id: number | null) => useQuery({ ...getAssayQueryOptions(id ?? 0), enabled: id !== null });
