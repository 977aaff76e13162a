import { useMutation } from '@tanstack/react-query';
import { greenCheckoutResponseSchema, type GreenCheckoutRequest, type GreenCheckoutResponse } from '@shared/schemas/checkout';
import { apiRequest } from '@/lib/api-client';

/** Places the order with its stock held and opens its payment page (`checkoutUrl`). */
export function createGreenCheckout(input: GreenCheckoutRequest): Promise<GreenCheckoutResponse> {
  return apiRequest('/api/checkout/green', { method: 'POST', body: input, schema: greenCheckoutResponseSchema });
}

export function useCreateGreenCheckout() {
  return useMutation({ mutationFn: createGreenCheckout });
}
