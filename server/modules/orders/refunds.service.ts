import Stripe from 'stripe';
import type { RefundOrderBody, RefundResponse } from '@shared/schemas/packing';
import type { PaymentsGateway } from '../../integrations/payments';
import { AppError } from '../../lib/app-error';
import { orderIdKey } from '../payments';
import type { RefundsRepo } from './refunds.repo';

/** Metadata key on a Stripe refund holding the client's Idempotency-Key, so a repeated request finds its refund. */
export const refundRequestKey = 'restday_refund_request';

const idOf = (value: string | { id: string } | null | undefined) => (typeof value === 'string' ? value : (value?.id ?? null));

export interface RefundsDeps {
  repo: RefundsRepo;
  gateway: PaymentsGateway;
}

/**
 * Owner refunds through Stripe. Restday asks Stripe for the refund and answers 202: the order's
 * refunded amount and status change only when Stripe's `charge.refunded` webhook arrives, in the
 * payments module. A green order refunded in full before it ships gets its coffee back in stock.
 */
export function createRefundsService({ repo, gateway }: RefundsDeps) {
  /** Stripe's own running figures for the payment, which count refunds whose webhook has not come yet. */
  async function chargeOf(paymentIntentId: string) {
    const intent = await gateway.retrievePaymentIntent(paymentIntentId);
    const chargeId = idOf(intent.latest_charge);
    const charge = chargeId ? await gateway.retrieveCharge(chargeId) : undefined;
    if (!charge || charge.status !== 'succeeded') throw AppError.conflict('not_paid', 'This order has no payment to refund.');
    return charge;
  }

  /** The refund an earlier request with the same Idempotency-Key made, if any. */
  async function earlierRefund(paymentIntentId: string, requestKey: string) {
    for await (const refund of gateway.stripe.refunds.list({ payment_intent: paymentIntentId, limit: 100 })) {
      if (refund.metadata?.[refundRequestKey] === requestKey) return refund;
    }
    return undefined;
  }

  async function answer(orderId: string, requestedCents: number): Promise<RefundResponse> {
    const current = await repo.findOrder(orderId);
    return { refundedCents: current!.refundedCents, status: current!.status, requestedCents };
  }

  return {
    /**
     * `requestKey` is the request's Idempotency-Key header: the same key again answers with the
     * refund it made instead of refunding twice (a double click, a retry after a lost answer).
     */
    async refund(orderId: string, body: RefundOrderBody, actorId: string, requestKey?: string): Promise<RefundResponse> {
      const order = await repo.findOrder(orderId);
      if (!order) throw AppError.notFound('Order');
      if (!order.stripePaymentIntentId || order.status === 'pending_payment' || order.status === 'cancelled') {
        throw AppError.conflict('not_paid', 'This order has no payment to refund.');
      }
      const paymentIntentId = order.stripePaymentIntentId;
      if (requestKey) {
        const earlier = await earlierRefund(paymentIntentId, requestKey);
        if (earlier) return answer(order.id, earlier.amount);
      }
      const charge = await chargeOf(paymentIntentId);
      const remaining = charge.amount - charge.amount_refunded;
      if (remaining <= 0) {
        // A retry after the refund went through but the stock step failed still puts the stock back (once).
        if (order.kind === 'green') await repo.returnUnshippedStock(order.id, actorId);
        throw AppError.conflict('already_refunded', 'This order is already refunded in full.');
      }
      const amount = body.amountCents ?? remaining;
      if (amount > remaining) {
        throw AppError.badRequest('The refund is more than is left to refund.', { amountCents: `At most ${remaining} cents is left to refund.` });
      }
      try {
        await gateway.stripe.refunds.create(
          {
            payment_intent: paymentIntentId,
            amount,
            ...(body.reason ? { reason: body.reason } : {}),
            metadata: { [orderIdKey]: order.id, ...(requestKey ? { [refundRequestKey]: requestKey } : {}) },
          },
          // Two requests racing with one key, or the same figures against the same refunded total, make one refund.
          { idempotencyKey: requestKey ? `order-${order.id}-refund-${requestKey}` : `order-${order.id}-refund-${amount}-after-${charge.amount_refunded}` },
        );
      } catch (error) {
        if (error instanceof Stripe.errors.StripeInvalidRequestError || error instanceof Stripe.errors.StripeIdempotencyError) {
          throw AppError.conflict('refund_refused', `Stripe refused the refund: ${error.message}`);
        }
        throw error;
      }
      if (order.kind === 'green' && amount === remaining) await repo.returnUnshippedStock(order.id, actorId);
      return answer(order.id, amount);
    },
  };
}

export type RefundsService = ReturnType<typeof createRefundsService>;
