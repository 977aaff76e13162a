import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  subscriptionChangeResponseSchema,
  type SubscriptionChangeResponse,
  type SubscriptionPause,
  type SubscriptionUpdate,
} from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';
import { getSubscriberQueryOptions } from './get-subscriber';

const subscriptionPath = (id: string) => `/api/subscriptions/${encodeURIComponent(id)}`;

/** Staff changing a subscription on the subscriber's behalf (audited by the server); each answers with what changed. */
export type SubscriberAction =
  { kind: 'skip' } | { kind: 'pause'; body: SubscriptionPause } | { kind: 'resume' } | { kind: 'change'; body: SubscriptionUpdate };

export function actForSubscriber({ id, action }: { id: string; action: SubscriberAction }): Promise<SubscriptionChangeResponse> {
  const schema = subscriptionChangeResponseSchema;
  switch (action.kind) {
    case 'skip':
      return apiRequest(`${subscriptionPath(id)}/skip`, { method: 'POST', body: {}, schema });
    case 'pause':
      return apiRequest(`${subscriptionPath(id)}/pause`, { method: 'POST', body: action.body, schema });
    case 'resume':
      return apiRequest(`${subscriptionPath(id)}/resume`, { method: 'POST', schema });
    case 'change':
      return apiRequest(subscriptionPath(id), { method: 'PATCH', body: action.body, schema });
  }
}

export function useActForSubscriber() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: actForSubscriber,
    onSuccess: (_answer, { id }) => queryClient.invalidateQueries({ queryKey: getSubscriberQueryOptions(id).queryKey }),
  });
}
