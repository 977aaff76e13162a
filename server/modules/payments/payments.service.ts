import type Stripe from 'stripe';
import { bagSizeDeclarations } from '@shared/domain/units';
import { grindLabels, roastLevelLabels, type BagSize } from '@shared/domain/vocabulary';
import { publicBaseUrl, type Config } from '../../config';
import type { PaymentsGateway } from '../../integrations/payments';
import { AppError } from '../../lib/app-error';
import type { PaymentsRepo } from './payments.repo';

/** Metadata keys on Stripe objects that lead a webhook back to Restday's rows. */
export const orderIdKey = 'restday_order_id';
export const subscriptionIdKey = 'restday_subscription_id';

export type PaymentsServiceConfig = Pick<Config, 'PUBLIC_URL' | 'HOST' | 'PORT' | 'STRIPE_CHECKOUT_EXPIRES_MINUTES'>;

/** Where the payer lands after the test-payment (or Stripe's) page, as paths on the shop. */
export interface ReturnPaths {
  successPath: string;
  cancelPath: string;
}

export interface CheckoutStarted {
  checkoutUrl: string;
  checkoutSessionId: string;
}

export interface PaymentsServiceDeps {
  repo: PaymentsRepo;
  gateway: PaymentsGateway;
  config: PaymentsServiceConfig;
}

const declaredSize = (size: BagSize) => `${bagSizeDeclarations[size].amount} ${bagSizeDeclarations[size].unit}`;

/**
 * Starts payments. Nothing here marks anything paid: only a signed webhook does that
 * (payment-events.service.ts), never the payer's return to the success URL.
 */
export function createPaymentsService({ repo, gateway, config }: PaymentsServiceDeps) {
  const baseUrl = publicBaseUrl(config);
  // Stripe checks this against its own time, so it is real time, never the shop's test clock.
  const expiresAt = () => Math.floor(Date.now() / 1000) + config.STRIPE_CHECKOUT_EXPIRES_MINUTES * 60;
  /**
   * An order's first session expires a fixed time after the order was placed (the database's real
   * time), so a retry sends exactly the parameters of the first try and Stripe's idempotency replays
   * the session that try made instead of refusing the key.
   */
  const orderExpiresAt = (createdAt: Date) => Math.floor(createdAt.getTime() / 1000) + config.STRIPE_CHECKOUT_EXPIRES_MINUTES * 60;

  /**
   * The open session a row already has, if any; a paid one is a conflict. An expired one gives way to
   * a new session under a new idempotency key (the old key would replay the expired session).
   */
  async function reuseOpenSession(sessionId: string | null, alreadyPaid: AppError): Promise<CheckoutStarted | undefined> {
    if (!sessionId) return undefined;
    const existing = await gateway.retrieveCheckoutSession(sessionId);
    if (existing.status === 'complete') throw alreadyPaid;
    if (existing.status === 'open' && existing.url) return { checkoutUrl: existing.url, checkoutSessionId: existing.id };
    return undefined;
  }

  const idempotencyKey = (kind: string, id: string, previousSessionId: string | null) =>
    previousSessionId ? `${kind}-${id}-after-${previousSessionId}` : `${kind}-${id}`;

  function started(session: Stripe.Checkout.Session): CheckoutStarted {
    if (!session.url) throw new Error(`Checkout Session ${session.id} has no URL`);
    return { checkoutUrl: session.url, checkoutSessionId: session.id };
  }

  return {
    /** A Checkout Session (`mode: payment`) for a green coffee order waiting for payment. */
    async createCheckoutForOrder(
      orderId: string,
      paths: ReturnPaths = { successPath: `/orders/${orderId}?checkout=complete`, cancelPath: '/cart?checkout=cancelled' },
    ): Promise<CheckoutStarted> {
      const order = await repo.findOrder(orderId);
      if (!order) throw AppError.notFound('Order');
      if (order.kind !== 'green') {
        throw AppError.conflict('order_not_payable', 'A subscription delivery is paid by its subscription, not at checkout.');
      }
      if (order.status !== 'pending_payment') throw AppError.conflict('order_not_payable', 'This order is not waiting for payment.');
      const reused = await reuseOpenSession(
        order.stripeCheckoutSessionId,
        AppError.conflict('order_already_paid', 'This order has been paid; its confirmation is on its way.'),
      );
      if (reused) return reused;

      const lines = await repo.orderLines(orderId);
      const lineItems: Stripe.Checkout.SessionCreateParams.LineItem[] = lines.map((line) => ({
        price_data: {
          currency: order.currency,
          unit_amount: line.unitPriceCents,
          product_data: { name: `${line.description}, green coffee, ${declaredSize(line.size)}` },
        },
        quantity: line.quantity,
      }));
      if (order.shippingCents > 0) {
        lineItems.push({ price_data: { currency: order.currency, unit_amount: order.shippingCents, product_data: { name: 'Shipping' } }, quantity: 1 });
      }
      const charged = lines.reduce((sum, line) => sum + line.lineTotalCents, 0) + order.shippingCents;
      if (charged !== order.totalCents) throw new Error(`Order ${orderId} lines add up to ${charged}, not its total ${order.totalCents}`);

      const session = await gateway.createCheckoutSession(
        {
          mode: 'payment',
          line_items: lineItems,
          customer_email: order.customerEmail,
          client_reference_id: order.id,
          metadata: { [orderIdKey]: order.id },
          payment_intent_data: { metadata: { [orderIdKey]: order.id } },
          success_url: `${baseUrl}${paths.successPath}`,
          cancel_url: `${baseUrl}${paths.cancelPath}`,
          expires_at: order.stripeCheckoutSessionId ? expiresAt() : orderExpiresAt(order.createdAt),
        },
        idempotencyKey('order', order.id, order.stripeCheckoutSessionId),
      );
      if (!(await repo.setOrderCheckoutSession(order.id, session.id))) {
        throw AppError.conflict('order_not_payable', 'This order was cancelled before its payment page opened. Nothing was charged; check out again.');
      }
      return started(session);
    },

    /** A Checkout Session (`mode: subscription`, a weekly recurring price) for a subscription not started yet. */
    async createCheckoutForSubscription(
      subscriptionId: string,
      paths: ReturnPaths = { successPath: `/subscriptions/${subscriptionId}?checkout=complete`, cancelPath: '/subscribe?checkout=cancelled' },
    ): Promise<CheckoutStarted> {
      const subscription = await repo.findSubscription(subscriptionId);
      if (!subscription) throw AppError.notFound('Subscription');
      if (subscription.status !== 'incomplete') throw AppError.conflict('subscription_not_payable', 'This subscription has already started.');
      const reused = await reuseOpenSession(
        subscription.stripeCheckoutSessionId,
        AppError.conflict('subscription_already_paid', 'This subscription has been paid; it starts shortly.'),
      );
      if (reused) return reused;

      const every = subscription.cadenceWeeks === 1 ? 'every week' : `every ${subscription.cadenceWeeks} weeks`;
      const bags = `${subscription.bagsPerDelivery} × ${declaredSize(subscription.bagSize)} bag${subscription.bagsPerDelivery === 1 ? '' : 's'}`;
      const session = await gateway.createCheckoutSession(
        {
          mode: 'subscription',
          line_items: [
            {
              price_data: {
                currency: subscription.currency,
                unit_amount: subscription.priceCents,
                product_data: {
                  name: `Roasted to Order: ${subscription.coffee}`,
                  description: `${bags}, ${roastLevelLabels[subscription.roastLevel]}, ${grindLabels[subscription.grind]}, ${every}`,
                },
                recurring: { interval: 'week', interval_count: subscription.cadenceWeeks },
              },
              quantity: 1,
            },
          ],
          ...(subscription.stripeCustomerId ? { customer: subscription.stripeCustomerId } : { customer_email: subscription.customerEmail }),
          client_reference_id: subscription.id,
          metadata: { [subscriptionIdKey]: subscription.id },
          subscription_data: { metadata: { [subscriptionIdKey]: subscription.id } },
          success_url: `${baseUrl}${paths.successPath}`,
          cancel_url: `${baseUrl}${paths.cancelPath}`,
          expires_at: expiresAt(),
        },
        idempotencyKey('subscription', subscription.id, subscription.stripeCheckoutSessionId),
      );
      await repo.setSubscriptionCheckoutSession(subscription.id, session.id);
      return started(session);
    },
  };
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
