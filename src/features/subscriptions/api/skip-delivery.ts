import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionChangeResponseSchema, type SubscriptionChangeResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Skips the delivery roasting on `roastDate`; the answer's notice says whether a payment moved, and where. */
export function skipDelivery({ id, roastDate }: { id: string; roastDate: string }): Promise<SubscriptionChangeResponse> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/deliveries/${encodeURIComponent(roastDate)}/skip`, {
    method: 'POST',
    schema: subscriptionChangeResponseSchema,
  });
}

export function useSkipDelivery() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: skipDelivery, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
