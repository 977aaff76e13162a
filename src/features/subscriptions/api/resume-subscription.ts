import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** Ends a pause now; deliveries start again from the next open roast day. */
export function resumeSubscription({ id }: { id: string }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/resume`, { method: 'POST', schema: subscriptionSchema });
}

export function useResumeSubscription() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resumeSubscription, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
