import { useMutation } from '@tanstack/react-query';
import { checkoutUrlResponseSchema, type CheckoutUrlResponse } from '@shared/schemas/checkout';
import { apiRequest } from '@/lib/api-client';
import { leaveFor } from '@/lib/leave-for';

/** "Pay now": the payment page of the same order, its bags still held. */
export function payOrder(id: string): Promise<CheckoutUrlResponse> {
  return apiRequest(`/api/orders/${encodeURIComponent(id)}/pay`, { method: 'POST', schema: checkoutUrlResponseSchema });
}

export function usePayOrder() {
  return useMutation({ mutationFn: payOrder, onSuccess: ({ checkoutUrl }) => leaveFor(checkoutUrl) });
}
