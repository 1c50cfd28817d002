import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EnzymeSummaryDto } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';

export const getEnzymes = () => api.get<{ rows: EnzymeSummaryDto[]; total: number }>('/enzymes');

export const getEnzymesQueryOptions = () => queryOptions({ queryKey: ['enzymes', 'list'], queryFn: getEnzymes });

export const useEnzymes = () => useQuery(getEnzymesQueryOptions());
