import { queryOptions, useQuery } from '@tanstack/react-query';
import { orderListResponseSchema, type OrderListResponse } from '@shared/schemas/orders';
import { apiRequest } from '@/lib/api-client';

/** The signed-in customer's own orders, newest first, one page at a time. */
export function getOrders({ page, signal }: { page: number; signal?: AbortSignal }): Promise<OrderListResponse> {
  return apiRequest('/api/orders', { schema: orderListResponseSchema, params: new URLSearchParams({ page: String(page), sort: 'newest' }), signal });
}

/** The root of every order query (the list's pages and each order): a change to an order invalidates it. */
export const ordersQueryKey = ['orders'] as const;

export function getOrdersQueryOptions(page = 1) {
  return queryOptions({
    queryKey: [...ordersQueryKey, 'list', { page }],
    queryFn: ({ signal }) => getOrders({ page, signal }),
  });
}

export function useOrders(page = 1) {
  return useQuery(getOrdersQueryOptions(page));
}
