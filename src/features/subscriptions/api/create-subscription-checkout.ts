import { useMutation } from '@tanstack/react-query';
import { subscriptionCheckoutResponseSchema, type SubscriptionCheckoutRequest, type SubscriptionCheckoutResponse } from '@shared/schemas/subscriptions';
import { apiRequest } from '@/lib/api-client';

/** Creates the subscription (not started until paid) and opens its payment page (`checkoutUrl`). */
export function createSubscriptionCheckout(input: SubscriptionCheckoutRequest): Promise<SubscriptionCheckoutResponse> {
  return apiRequest('/api/checkout/subscription', { method: 'POST', body: input, schema: subscriptionCheckoutResponseSchema });
}

export function useCreateSubscriptionCheckout() {
  return useMutation({ mutationFn: createSubscriptionCheckout });
}
