import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Skips the delivery roasting on `roastDate`, or the next one whose cutoff has not passed. */
export function skipDelivery({ id, roastDate }: { id: string; roastDate?: string }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/skip`, {
    method: 'POST',
    body: roastDate ? { roastDate } : {},
    schema: subscriptionSchema,
  });
}

export function useSkipDelivery() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: skipDelivery, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
