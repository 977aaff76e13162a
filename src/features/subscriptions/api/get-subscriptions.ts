import { queryOptions, useQuery } from '@tanstack/react-query';
import { subscriptionListResponseSchema, type SubscriptionListResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';

/** The signed-in customer's own subscriptions, newest first. */
export function getSubscriptions({ signal }: { signal?: AbortSignal } = {}): Promise<SubscriptionListResponse> {
  return apiRequest('/api/subscriptions', { schema: subscriptionListResponseSchema, signal });
}

export function getSubscriptionsQueryOptions() {
  return queryOptions({
    queryKey: ['subscriptions', 'list'],
    queryFn: ({ signal }) => getSubscriptions({ signal }),
  });
}

export function useSubscriptions() {
  return useQuery(getSubscriptionsQueryOptions());
}
