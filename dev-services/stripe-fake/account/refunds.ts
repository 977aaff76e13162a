// Refunds of a charge, whole or in part.
import { StripeApiError } from '../api-error';
import type { RefundCreateParams } from '../params';
import { newId } from '../store';
import type { AccountContext } from './context';

export function refundApi({ store, state, now, emit, find }: AccountContext) {
  return {
    createRefund(params: RefundCreateParams) {
      if (!params.payment_intent && !params.charge) {
        throw StripeApiError.invalid('One of `charge` or `payment_intent` is required.', 'payment_intent', 'parameter_missing');
      }
      const intent = params.payment_intent ? find(state.paymentIntents, params.payment_intent, 'payment_intent', 'payment_intent') : undefined;
      const chargeId = params.charge ?? intent?.latest_charge;
      const refunded = chargeId ? state.charges[chargeId] : undefined;
      if (!refunded || refunded.status !== 'succeeded') {
        throw StripeApiError.invalid('This payment has no successful charge to refund.', params.charge ? 'charge' : 'payment_intent');
      }
      const remaining = refunded.amount - refunded.amount_refunded;
      if (remaining === 0) throw StripeApiError.invalid(`Charge ${refunded.id} has already been refunded.`, undefined, 'charge_already_refunded');
      const amount = params.amount ?? remaining;
      if (amount > remaining) {
        throw StripeApiError.invalid(
          `Refund amount (${amount}) is greater than the unrefunded amount on the charge (${remaining}).`,
          'amount',
          'amount_too_large',
        );
      }
      const refund = {
        id: newId('re'),
        object: 'refund' as const,
        amount,
        charge: refunded.id,
        currency: refunded.currency,
        metadata: params.metadata ?? {},
        payment_intent: refunded.payment_intent,
        reason: params.reason ?? null,
        status: 'succeeded' as const,
        created: now(),
      };
      state.refunds[refund.id] = refund;
      const previous = { amount_refunded: refunded.amount_refunded, refunded: refunded.refunded };
      refunded.amount_refunded += amount;
      refunded.refunded = refunded.amount_refunded === refunded.amount;
      emit('charge.refunded', refunded, previous);
      store.changed();
      return refund;
    },
  };
}
