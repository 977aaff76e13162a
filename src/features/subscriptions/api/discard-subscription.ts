import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { getSubscriptionsQueryOptions } from './get-subscriptions';

/** "Discard": a subscription never paid for is cancelled and leaves the list. */
export async function discardSubscription(id: string): Promise<void> {
  await apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/discard`, { method: 'POST', schema: z.undefined() });
}

export function useDiscardSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: discardSubscription,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getSubscriptionsQueryOptions().queryKey }),
  });
}
