import { useMutation, useQueryClient } from '@tanstack/react-query';
import { subscriptionSchema, type Subscription } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { showChangedSubscription } from './subscription-cache';

/** No delivery roasts before `until` (a shop day); the first one on or after it goes ahead. */
export function pauseSubscription({ id, until }: { id: string; until: string }): Promise<Subscription> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/pause`, { method: 'POST', body: { until }, schema: subscriptionSchema });
}

export function usePauseSubscription() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: pauseSubscription, onSuccess: (changed) => showChangedSubscription(queryClient, changed) });
}
