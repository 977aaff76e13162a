import { queryOptions, useQuery } from '@tanstack/react-query';
import { subscriberDetailSchema, type SubscriberDetail } from '@shared/schemas/subscribers';
import { apiRequest } from '@/lib/api-client';

export function getSubscriber({ id, signal }: { id: string; signal?: AbortSignal }): Promise<SubscriberDetail> {
  return apiRequest(`/api/roastery/subscribers/${encodeURIComponent(id)}`, { schema: subscriberDetailSchema, signal });
}

export function getSubscriberQueryOptions(id: string) {
  return queryOptions({
    queryKey: ['subscribers', 'detail', id],
    queryFn: ({ signal }) => getSubscriber({ id, signal }),
  });
}

export function useSubscriber(id: string) {
  return useQuery(getSubscriberQueryOptions(id));
}
