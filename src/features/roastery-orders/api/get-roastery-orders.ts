import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { orderListResponseSchema, type OrderListResponse } from '@shared/schemas/orders';
import { apiRequest } from '@/lib/api-client';
import { roasteryOrderFiltersToSearchParams, type RoasteryOrderFilters } from '../utils/order-filters';

/** Every customer's orders (staff only), filtered, sorted and one page at a time. */
export function getRoasteryOrders({ filters, signal }: { filters: RoasteryOrderFilters; signal?: AbortSignal }): Promise<OrderListResponse> {
  return apiRequest('/api/orders', { schema: orderListResponseSchema, params: roasteryOrderFiltersToSearchParams(filters), signal });
}

/** The root of every page of the staff's order list: a change to an order invalidates it. */
export const getRoasteryOrdersQueryRoot = ['orders', 'roastery', 'list'] as const;

export function getRoasteryOrdersQueryOptions(filters: RoasteryOrderFilters) {
  return queryOptions({
    queryKey: [...getRoasteryOrdersQueryRoot, filters],
    queryFn: ({ signal }) => getRoasteryOrders({ filters, signal }),
  });
}

/**
 * While new filters load, the previous page stays on screen (`isPlaceholderData`). `enabled`
 * false: filters the API would refuse are not sent.
 */
export function useRoasteryOrders(filters: RoasteryOrderFilters, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getRoasteryOrdersQueryOptions(filters), placeholderData: keepPreviousData, enabled });
}
