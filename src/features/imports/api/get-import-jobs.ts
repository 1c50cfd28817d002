import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportJobSummaryDto } from '@shared/schemas/import';
import { api } from '@/lib/api-client';

/** The import history, newest first. */
export const getImportJobs = async () => (await api.get<{ rows: ImportJobSummaryDto[] }>('/imports')).rows;

export const getImportJobsQueryOptions = () => queryOptions({ queryKey: ['imports', 'history'], queryFn: getImportJobs });

export const useImportJobs = () => useQuery(getImportJobsQueryOptions());
