import { useMutation } from '@tanstack/react-query';
import { checkoutUrlResponseSchema, type CheckoutUrlResponse } from '@shared/schemas/checkout';
import { apiRequest } from '@/lib/api-client';
import { leaveFor } from '@/lib/leave-for';

/** "Pay now": the first payment of the same subscription. */
export function paySubscription(id: string): Promise<CheckoutUrlResponse> {
  return apiRequest(`/api/subscriptions/${encodeURIComponent(id)}/pay`, { method: 'POST', schema: checkoutUrlResponseSchema });
}

export function usePaySubscription() {
  return useMutation({ mutationFn: paySubscription, onSuccess: ({ checkoutUrl }) => leaveFor(checkoutUrl) });
}
