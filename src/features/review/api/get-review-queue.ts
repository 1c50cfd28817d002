import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { api } from '@/lib/api-client';

/** Measurements per page of the review list. */
export const reviewQueuePageSize = 50;

export interface ReviewQueuePage {
  items: MeasurementDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** Submitted measurements, newest first: what waits for a lead's approval or flag. */
export const getReviewQueue = (page: number) =>
  api.get<ReviewQueuePage>(`/measurements?reviewState=submitted&page=${page}&pageSize=${reviewQueuePageSize}`);

export const getReviewQueueQueryOptions = (page: number) =>
  queryOptions({ queryKey: ['measurements', 'review-queue', { page }], queryFn: () => getReviewQueue(page) });

export const useReviewQueue = (page: number) => useQuery({ ...getReviewQueueQueryOptions(page), placeholderData: keepPreviousData });
