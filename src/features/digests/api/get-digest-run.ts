import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DigestRunDto } from '@shared/schemas/digest';
import { api } from '@/lib/api-client';

export const getDigestRun = async (id: number) => (await api.get<{ run: DigestRunDto }>(`/digests/runs/${id}`)).run;

export const getDigestRunQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['digests', 'runs', id],
    queryFn: () => getDigestRun(id),
    // Delivery happens after the run is queued; follow it until no message is waiting.
    refetchInterval: (query) => {
      const run = query.state.data;
      return run && (run.status === 'preparing' || run.delivery.queued + run.delivery.sending > 0) ? 1000 : false;
    },
  });

export const useDigestRun = (id: number) => useQuery(getDigestRunQueryOptions(id));
