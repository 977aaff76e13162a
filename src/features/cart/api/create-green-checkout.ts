import { useMutation } from '@tanstack/react-query';
import { greenCheckoutResponseSchema, type GreenCheckoutRequest, type GreenCheckoutResponse } from '@shared/schemas/checkout';
import { apiRequest } from '@/lib/api-client';

export interface GreenCheckoutAttempt {
  input: GreenCheckoutRequest;
  /** The same key for a retry of the same cart and address, so a lost answer never places a second order. */
  checkoutKey: string;
}

/** Places the order with its stock held and opens its payment page (`checkoutUrl`). */
export function createGreenCheckout({ input, checkoutKey }: GreenCheckoutAttempt): Promise<GreenCheckoutResponse> {
  return apiRequest('/api/checkout/green', {
    method: 'POST',
    body: input,
    headers: { 'Idempotency-Key': checkoutKey },
    schema: greenCheckoutResponseSchema,
  });
}

export function useCreateGreenCheckout() {
  return useMutation({ mutationFn: createGreenCheckout });
}
