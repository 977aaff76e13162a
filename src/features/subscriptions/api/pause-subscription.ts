import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionChangeResponseSchema, type PaidDeliveryChoice, type SubscriptionChangeResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/**
 * No delivery roasts before `until` (a shop day); the first one on or after it goes ahead. A paid
 * delivery inside the pause needs `paidDelivery` (ship it, or hold it for after the pause).
 */
export function pauseSubscription({
  id,
  until,
  paidDelivery,
}: {
  id: string;
  until: string;
  paidDelivery?: PaidDeliveryChoice;
}): Promise<SubscriptionChangeResponse> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/pause`, {
    method: 'POST',
    body: paidDelivery ? { until, paidDelivery } : { until },
    schema: subscriptionChangeResponseSchema,
  });
}

export function usePauseSubscription() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: pauseSubscription, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
