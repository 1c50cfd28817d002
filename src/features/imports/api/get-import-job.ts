import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { runningImportStatuses, type ImportJobDto } from '@shared/schemas/import';
import { api } from '@/lib/api-client';

// Progress is written to the job as the server works; half a second keeps the bar moving without load.
const POLL_MS = 500;

export const getImportJob = async (id: number) => (await api.get<{ job: ImportJobDto }>(`/imports/${id}`)).job;

export const getImportJobQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['imports', 'job', id],
    queryFn: () => getImportJob(id),
    refetchInterval: (query) => (query.state.data && runningImportStatuses.includes(query.state.data.status) ? POLL_MS : false),
  });

/**
 * One import job, polled while the server checks or writes its rows (so a reloaded page picks the work up
 * again). When a commit finishes, everything else the app has loaded may be out of date and is refetched.
 */
export function useImportJob(id: number) {
  const queryClient = useQueryClient();
  const query = useQuery(getImportJobQueryOptions(id));
  const status = query.data?.status;
  const previous = useRef(status);
  useEffect(() => {
    if (previous.current === 'committing' && status === 'committed') {
      void queryClient.invalidateQueries({ predicate: (cached) => cached.queryKey[0] !== 'imports' });
      void queryClient.invalidateQueries({ queryKey: ['imports', 'history'] });
    }
    previous.current = status;
  }, [queryClient, status]);
  return query;
}
