import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportProblemsDto } from '@shared/schemas/import';
import { api } from '@/lib/api-client';

export const importProblemsPageSize = 25;

/** One page of a job's problems, by row. */
export const getImportProblems = (id: number, page: number) =>
  api.get<ImportProblemsDto>(`/imports/${id}/problems?page=${page}&pageSize=${importProblemsPageSize}`);

export const getImportProblemsQueryOptions = (id: number, page: number, version: number) =>
  queryOptions({ queryKey: ['imports', 'problems', id, version, page], queryFn: () => getImportProblems(id, page) });

/** The problems are read again whenever the job changes (a new preview), hence the version in the key. */
export const useImportProblems = (id: number, page: number, version: number) => useQuery(getImportProblemsQueryOptions(id, page, version));
