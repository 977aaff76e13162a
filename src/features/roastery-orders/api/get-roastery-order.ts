import { queryOptions, useQuery } from '@tanstack/react-query';
import { orderDetailSchema, type OrderDetail } from '@shared/schemas/orders';
import { apiRequest } from '@/lib/api-client';

/** Any customer's order in full (staff only). */
export function getRoasteryOrder({ id, signal }: { id: string; signal?: AbortSignal }): Promise<OrderDetail> {
  return apiRequest(`/api/orders/${encodeURIComponent(id)}`, { schema: orderDetailSchema, signal });
}

export function getRoasteryOrderQueryOptions(id: string) {
  return queryOptions({
    queryKey: ['orders', 'roastery', 'detail', id],
    queryFn: ({ signal }) => getRoasteryOrder({ id, signal }),
  });
}

export function useRoasteryOrder(id: string) {
  return useQuery(getRoasteryOrderQueryOptions(id));
}
