import { queryOptions, useQuery } from '@tanstack/react-query';
import { orderTraceSchema, type OrderTrace } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';

/** One order and the batches and lots its bags came from. */
export function getOrderTrace({ id, signal }: { id: string; signal?: AbortSignal }): Promise<OrderTrace> {
  return apiRequest(`/api/orders/${encodeURIComponent(id)}/trace`, { schema: orderTraceSchema, signal });
}

export function getOrderTraceQueryOptions(id: string) {
  return queryOptions({
    queryKey: ['roastery', 'order-trace', id],
    queryFn: ({ signal }) => getOrderTrace({ id, signal }),
  });
}

export function useOrderTrace(id: string) {
  return useQuery(getOrderTraceQueryOptions(id));
}
