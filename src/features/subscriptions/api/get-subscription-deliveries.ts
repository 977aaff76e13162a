import { queryOptions, useQuery } from '@tanstack/react-query';
import { subscriptionDeliveriesResponseSchema, type SubscriptionDeliveriesResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';

/** How many deliveries Deliveries shows ahead. */
export const DELIVERIES_SHOWN = 6;

export function getSubscriptionDeliveries({ id, count, signal }: { id: string; count: number; signal?: AbortSignal }): Promise<SubscriptionDeliveriesResponse> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/deliveries`, {
    schema: subscriptionDeliveriesResponseSchema,
    params: new URLSearchParams({ count: String(count) }),
    signal,
  });
}

export function getSubscriptionDeliveriesQueryOptions(id: string, count: number = DELIVERIES_SHOWN) {
  return queryOptions({
    queryKey: ['subscriptions', 'deliveries', id, { count }],
    queryFn: ({ signal }) => getSubscriptionDeliveries({ id, count, signal }),
  });
}

export function useSubscriptionDeliveries(id: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getSubscriptionDeliveriesQueryOptions(id), enabled });
}
