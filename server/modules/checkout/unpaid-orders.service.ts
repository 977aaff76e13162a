import Stripe from 'stripe';
import type { PaymentsGateway } from '../../integrations/payments';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { staleBatchSize, type StaleUnpaidOrder, type UnpaidOrdersRepo } from './unpaid-orders.repo';

export interface UnpaidOrdersDeps {
  repo: UnpaidOrdersRepo;
  gateway: Pick<PaymentsGateway, 'retrieveCheckoutSession'>;
  /** The shop's clock: stamps the cancellation. */
  clock: Clock;
  /**
   * Real time, for the grace period and the page's lifetime: both are about real seconds (a request
   * in flight, Stripe's own expiry), and a test clock moved days ahead must not sweep checkouts that
   * are still running.
   */
  realClock: Clock;
  logger: Logger;
  /** UNPAID_ORDER_GRACE_MINUTES */
  graceMinutes: number;
  /** STRIPE_CHECKOUT_EXPIRES_MINUTES */
  pageMinutes: number;
}

const minutes = (n: number) => n * 60_000;

/**
 * Sweeps green orders left waiting for payment that nobody can pay any more, so their reserved
 * grams come back:
 * - no payment page recorded after the grace period: the checkout died between placing the order
 *   and saving its page (the database dropped, the process restarted). Its buyer never received a
 *   page (the page is handed out only after it is saved), so nobody can pay it;
 * - a page Stripe says has expired, or does not know: the expiry webhook never arrived.
 * Stock goes back once however many workers run it (see cancelIfUnchanged).
 */
export function createUnpaidOrdersService({ repo, gateway, clock, realClock, logger, graceMinutes, pageMinutes }: UnpaidOrdersDeps) {
  /** Whether Stripe says this order's page can no longer be paid. */
  async function pageIsGone(sessionId: string): Promise<boolean> {
    try {
      return (await gateway.retrieveCheckoutSession(sessionId)).status === 'expired';
    } catch (error) {
      if (error instanceof Stripe.errors.StripeInvalidRequestError && error.statusCode === 404) return true;
      throw error;
    }
  }

  async function reasonToCancel(order: StaleUnpaidOrder): Promise<string | undefined> {
    if (!order.stripeCheckoutSessionId) return 'no payment page was saved for it';
    return (await pageIsGone(order.stripeCheckoutSessionId)) ? `checkout ${order.stripeCheckoutSessionId} expired` : undefined;
  }

  return {
    /** One sweep; the number of orders it cancelled. */
    async reconcile(): Promise<number> {
      const now = realClock.now();
      const noPageBefore = new Date(now.getTime() - minutes(graceMinutes));
      const pageExpiredBefore = new Date(now.getTime() - minutes(pageMinutes + graceMinutes));
      let cancelled = 0;
      let after: StaleUnpaidOrder | undefined;
      for (;;) {
        const stale = await repo.staleUnpaidOrders(noPageBefore, pageExpiredBefore, after);
        for (const order of stale) {
          const reason = await reasonToCancel(order);
          if (reason && (await repo.cancelIfUnchanged(order, clock.now(), reason))) {
            cancelled++;
            logger.info({ orderId: order.id, reason }, 'unpaid order cancelled, stock put back');
          }
        }
        if (stale.length < staleBatchSize) return cancelled;
        after = stale.at(-1);
      }
    },
  };
}
