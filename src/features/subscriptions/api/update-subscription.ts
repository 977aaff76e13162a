import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription, type SubscriptionUpdate } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Changes the level, size, bags, grind, brew method, cadence or address from the next open delivery on. */
export function updateSubscription({ id, update }: { id: string; update: SubscriptionUpdate }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}`, { method: 'PATCH', body: update, schema: subscriptionSchema });
}

export function useUpdateSubscription() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateSubscription, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
