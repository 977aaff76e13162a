import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionChangeResponseSchema, type SubscriptionChangeResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Undoes the skip of the delivery roasting on `roastDate`, while its cutoff is ahead. */
export function unskipDelivery({ id, roastDate }: { id: string; roastDate: string }): Promise<SubscriptionChangeResponse> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/deliveries/${encodeURIComponent(roastDate)}/unskip`, {
    method: 'POST',
    schema: subscriptionChangeResponseSchema,
  });
}

export function useUnskipDelivery() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: unskipDelivery, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
