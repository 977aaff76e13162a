import { queryOptions, useQuery } from '@tanstack/react-query';
import { orderDetailSchema, type OrderDetail } from '@shared/schemas/orders';
import { apiRequest } from '@/lib/api-client';
import { ordersQueryKey } from './get-orders';

export function getOrder({ id, signal }: { id: string; signal?: AbortSignal }): Promise<OrderDetail> {
  return apiRequest(`/api/orders/${encodeURIComponent(id)}`, { schema: orderDetailSchema, signal });
}

export function getOrderQueryOptions(id: string) {
  return queryOptions({
    queryKey: [...ordersQueryKey, 'detail', id],
    queryFn: ({ signal }) => getOrder({ id, signal }),
  });
}

/** How often the return page asks whether the payment has been confirmed. */
export const PAYMENT_POLL_MS = 2000;

/**
 * One order. `awaitPayment`: while it is still `pending_payment`, ask again every few seconds:
 * only the payment webhook marks it paid, never the redirect back from the payment page.
 */
export function useOrder(id: string, { awaitPayment = false }: { awaitPayment?: boolean } = {}) {
  return useQuery({
    ...getOrderQueryOptions(id),
    refetchInterval: (query) => (awaitPayment && query.state.data?.status === 'pending_payment' ? PAYMENT_POLL_MS : false),
  });
}
