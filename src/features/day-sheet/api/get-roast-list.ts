import { queryOptions, useQuery } from '@tanstack/react-query';
import { roastListResponseSchema, type RoastListResponse } from '@shared/schemas/roastery';
import { apiRequest } from '@/lib/api-client';

export function roastListPath(date: string, format: 'json' | 'csv' = 'json'): string {
  const base = `/api/roastery/days/${encodeURIComponent(date)}/roast-list`;
  return format === 'json' ? base : `${base}.${format}`;
}

/** The Roast List as a PDF on Letter or A4 paper. */
export function roastListPdfPath(date: string, paper: 'letter' | 'a4'): string {
  return `/api/roastery/days/${encodeURIComponent(date)}/roast-list.pdf?paper=${paper}`;
}

/** What a roast day needs: lines by lot and level, the pull list against stock, totals and warnings. */
export function getRoastList({ date, signal }: { date: string; signal?: AbortSignal }): Promise<RoastListResponse> {
  return apiRequest(roastListPath(date), { schema: roastListResponseSchema, signal });
}

export function getRoastListQueryOptions(date: string) {
  return queryOptions({
    queryKey: ['roastery', 'roast-list', date],
    queryFn: ({ signal }) => getRoastList({ date, signal }),
  });
}

export function useRoastList(date: string) {
  return useQuery(getRoastListQueryOptions(date));
}
