import { queryOptions, useQuery } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';

export function getSubscription({ id, signal }: { id: string; signal?: AbortSignal }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}`, { schema: subscriptionSchema, signal });
}

export function getSubscriptionQueryOptions(id: string) {
  return queryOptions({
    queryKey: ['subscriptions', 'detail', id],
    queryFn: ({ signal }) => getSubscription({ id, signal }),
  });
}

/** How often the return page asks whether the first payment has been confirmed. */
export const ACTIVATION_POLL_MS = 2000;

/**
 * One subscription. `awaitActivation`: while it is still `incomplete`, ask again every few
 * seconds: only the payment webhook starts it, never the redirect back from the payment page.
 */
export function useSubscription(id: string, { awaitActivation = false }: { awaitActivation?: boolean } = {}) {
  return useQuery({
    ...getSubscriptionQueryOptions(id),
    refetchInterval: (query) => (awaitActivation && query.state.data?.status === 'incomplete' ? ACTIVATION_POLL_MS : false),
  });
}
