import { queryOptions, useQuery } from '@tanstack/react-query';
import { greenStockResponseSchema, type GreenStockResponse } from '@shared/schemas/green-stock';
import { apiRequest } from '@/lib/api-client';

/** Every lot, listed or not, with grams on hand, reorder alert and days of cover (staff only). */
export function getGreenStock({ signal }: { signal?: AbortSignal } = {}): Promise<GreenStockResponse> {
  return apiRequest('/api/roastery/green-stock', { schema: greenStockResponseSchema, signal });
}

export function getGreenStockQueryOptions() {
  return queryOptions({
    queryKey: ['green-stock', 'list'],
    queryFn: ({ signal }) => getGreenStock({ signal }),
  });
}

export function useGreenStock() {
  return useQuery(getGreenStockQueryOptions());
}
