import type { LabelStockId } from '@shared/domain/label-stock';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { packListResponseSchema, type PackListResponse } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';

/** The day's bag labels as a PDF: one 4 × 3 in label a page, or `stock`'s sheet of ten. */
export function labelsPdfPath(date: string, stock?: Exclude<LabelStockId, 'single'>): string {
  return `/api/roastery/days/${encodeURIComponent(date)}/labels.pdf${stock ? `?stock=${stock}` : ''}`;
}

/** The orders that ship on `date`, each bag with what its label says. */
export function getPackList({ date, signal }: { date: string; signal?: AbortSignal }): Promise<PackListResponse> {
  return apiRequest(`/api/roastery/days/${encodeURIComponent(date)}/pack-list`, { schema: packListResponseSchema, signal });
}

export function getPackListQueryOptions(date: string) {
  return queryOptions({
    queryKey: ['roastery', 'pack-list', date],
    queryFn: ({ signal }) => getPackList({ date, signal }),
  });
}

export function usePackList(date: string) {
  return useQuery(getPackListQueryOptions(date));
}
