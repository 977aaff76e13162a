import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Cancels at the end of the paid period: deliveries already paid for still roast and ship. */
export function cancelSubscription({ id }: { id: string }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/cancel`, { method: 'POST', schema: subscriptionSchema });
}

export function useCancelSubscription() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: cancelSubscription, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
