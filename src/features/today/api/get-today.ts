import { queryOptions, useQuery } from '@tanstack/react-query';
import { todayResponseSchema, type TodayResponse } from '@shared/schemas/today';
import { apiRequest } from '@/lib/api-client';

/** Today in the Roastery: the next roast day's work, parcels due out, what is stuck, lots to reorder (staff). */
export function getToday({ signal }: { signal?: AbortSignal } = {}): Promise<TodayResponse> {
  return apiRequest('/api/roastery/today', { schema: todayResponseSchema, signal });
}

export function getTodayQueryOptions() {
  return queryOptions({ queryKey: ['roastery', 'today'], queryFn: ({ signal }) => getToday({ signal }) });
}

export function useToday() {
  return useQuery(getTodayQueryOptions());
}
