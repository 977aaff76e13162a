import { queryOptions, useQuery } from '@tanstack/react-query';
import { planningResponseSchema, type PlanningResponse } from '@shared/schemas/planning';
import { apiRequest } from '@/lib/api-client';

/** Green planning: each lot's green needs by week, its run-out day and reorder-by day (staff). */
export function getPlanning(weeks: number, { signal }: { signal?: AbortSignal } = {}): Promise<PlanningResponse> {
  return apiRequest(`/api/roastery/planning?weeks=${weeks}`, { schema: planningResponseSchema, signal });
}

export function getPlanningQueryOptions(weeks = 8) {
  return queryOptions({ queryKey: ['roastery', 'planning', weeks], queryFn: ({ signal }) => getPlanning(weeks, { signal }) });
}

export function usePlanning(weeks = 8) {
  return useQuery(getPlanningQueryOptions(weeks));
}

export const planningCsvHref = (weeks: number) => `/api/roastery/planning.csv?weeks=${weeks}`;
