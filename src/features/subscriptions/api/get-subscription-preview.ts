import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { subscriptionPreviewSchema, type SubscriptionPreview, type SubscriptionPreviewQuery } from '@shared/schemas/subscription-preview';
import { apiRequest } from '@/lib/api-client';

function previewParams(choice: SubscriptionPreviewQuery): URLSearchParams {
  const params = new URLSearchParams({
    roastLevel: choice.roastLevel,
    bagSize: choice.bagSize,
    bagsPerDelivery: String(choice.bagsPerDelivery),
    brewMethod: choice.brewMethod,
    cadenceWeeks: String(choice.cadenceWeeks),
  });
  if (choice.lotCode) params.set('lotCode', choice.lotCode);
  return params;
}

/** What a choice costs per delivery, and its first three deliveries if paid now. */
export function getSubscriptionPreview({ choice, signal }: { choice: SubscriptionPreviewQuery; signal?: AbortSignal }): Promise<SubscriptionPreview> {
  return apiRequest('/api/subscriptions/preview', { schema: subscriptionPreviewSchema, params: previewParams(choice), signal });
}

export function getSubscriptionPreviewQueryOptions(choice: SubscriptionPreviewQuery) {
  return queryOptions({
    queryKey: ['subscriptions', 'preview', choice],
    queryFn: ({ signal }) => getSubscriptionPreview({ choice, signal }),
  });
}

/** While a new choice is priced, the last price stays on screen (`isPlaceholderData`) rather than blanking. */
export function useSubscriptionPreview(choice: SubscriptionPreviewQuery) {
  return useQuery({ ...getSubscriptionPreviewQueryOptions(choice), placeholderData: keepPreviousData });
}
