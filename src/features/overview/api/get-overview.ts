import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OverviewDto } from '@shared/schemas/overview';
import { api } from '@/lib/api-client';

export const getOverview = () => api.get<OverviewDto>('/overview');

export const getOverviewQueryOptions = () => queryOptions({ queryKey: ['overview'], queryFn: getOverview });

export const useOverview = () => useQuery(getOverviewQueryOptions());
