import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  stockAdjustmentResponseSchema,
  stockMovementListResponseSchema,
  type StockAdjustment,
  type StockAdjustmentResponse,
  type StockMovementListResponse,
} from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';
import { getGreenStockQueryOptions } from './get-green-stock';

const lotPath = (code: string) => `/api/lots/${encodeURIComponent(code)}`;

/** The lot's stock history, newest first. */
export function getStockMovements({ code, signal }: { code: string; signal?: AbortSignal }): Promise<StockMovementListResponse> {
  return apiRequest(`${lotPath(code)}/stock-movements`, { schema: stockMovementListResponseSchema, signal });
}

export function getStockMovementsQueryOptions(code: string) {
  return queryOptions({
    queryKey: ['green-stock', 'movements', code],
    queryFn: ({ signal }) => getStockMovements({ code, signal }),
  });
}

export function useStockMovements(code: string) {
  return useQuery(getStockMovementsQueryOptions(code));
}

/** Adds or takes away grams with a reason; refused (409) if stock would go below zero. */
export function adjustStock({ code, adjustment }: { code: string; adjustment: StockAdjustment }): Promise<StockAdjustmentResponse> {
  return apiRequest(`${lotPath(code)}/stock-adjustments`, { method: 'POST', body: adjustment, schema: stockAdjustmentResponseSchema });
}

export function useAdjustStock() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: adjustStock,
    onSuccess: (_result, { code }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getStockMovementsQueryOptions(code).queryKey }),
        queryClient.invalidateQueries({ queryKey: getGreenStockQueryOptions().queryKey }),
      ]),
  });
}
