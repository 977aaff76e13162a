import { queryOptions, useQuery } from '@tanstack/react-query';
import { batchListResponseSchema, type BatchListResponse } from '@shared/schemas/roastery';
import { apiRequest } from '@/lib/api-client';

/** The batches recorded for a roast day, in the order they were recorded. */
export function getDayBatches({ date, signal }: { date: string; signal?: AbortSignal }): Promise<BatchListResponse> {
  return apiRequest(`/api/roastery/days/${encodeURIComponent(date)}/batches`, { schema: batchListResponseSchema, signal });
}

export function getDayBatchesQueryOptions(date: string) {
  return queryOptions({
    queryKey: ['roastery', 'day-batches', date],
    queryFn: ({ signal }) => getDayBatches({ date, signal }),
  });
}

export function useDayBatches(date: string) {
  return useQuery(getDayBatchesQueryOptions(date));
}
