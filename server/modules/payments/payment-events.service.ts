import Stripe from 'stripe';
import { z } from 'zod';
import { findUnstorableText, unstorableTextMessage } from '@shared/schemas/text';
import { greenOrderDates } from '@shared/domain/roast-schedule';
import { localDateOf } from '@shared/domain/shop-time';
import type { WebhookReceipt } from '@shared/schemas/payments';
import { subscriptionStatusOf, type PaymentStanding } from '@shared/domain/subscription-status';
import { roastedBagSizes, type BagSize, type RoastedBagSize } from '@shared/domain/vocabulary';
import { publicBaseUrl } from '../../config';
import type { PaymentsGateway } from '../../integrations/payments';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { queueEmail } from '../outbox';
import { loadCalendarOverrides, loadShopSettings } from '../settings';
import type { PaidInvoice, PaymentEventPorts } from './payment-event-ports';
import type { PaymentsRepo, PaymentsTransaction, SubscriptionForPayment } from './payments.repo';
import { orderIdKey, subscriptionIdKey, type PaymentsServiceConfig } from './payments.service';

export interface PaymentEventsDeps {
  repo: PaymentsRepo;
  ports: PaymentEventPorts;
  gateway: PaymentsGateway;
  clock: Clock;
  logger: Logger;
  config: Pick<PaymentsServiceConfig, 'PUBLIC_URL' | 'HOST' | 'PORT'>;
  /**
   * Hands a received event to the job queue to apply. Without one (API-only test apps) the
   * webhook applies the event before it answers.
   */
  enqueueEvent?: (eventId: string) => Promise<void>;
}

/** The least of an event the inbox needs; a signed body without it is refused, not retried. */
const receivableEventSchema = z.object({
  id: z.string().min(1).max(255),
  type: z.string().min(1).max(255),
  data: z.object({ object: z.looseObject({ id: z.string().min(1).max(255) }) }),
});

/** The part of an event that must run in the ledger's transaction (after the Stripe reads, which must not). */
type Effect = (tx: PaymentsTransaction) => Promise<void>;

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const idOf = (value: string | { id: string } | null | undefined) => (typeof value === 'string' ? value : (value?.id ?? null));
const fromUnix = (seconds: number | null | undefined) => (seconds ? new Date(seconds * 1000) : null);

/** Subscriptions sell roasted bag sizes only (a CHECK constraint keeps it so). */
function roastedSizeOf(size: BagSize): RoastedBagSize {
  const roasted = roastedBagSizes.find((candidate) => candidate === size);
  if (!roasted) throw new Error(`A subscription has the green bag size ${size}`);
  return roasted;
}

/**
 * Restday's reading of a Stripe subscription's standing. Its `pause_collection` is only Restday's own
 * pause pushed back to us (maybe not yet, maybe an old one), so it never decides the status; Stripe's
 * own `paused` (a trial ended with no way to pay) is a payment that cannot be taken.
 */
function paymentStandingOf(subscription: Stripe.Subscription): PaymentStanding {
  switch (subscription.status) {
    case 'active':
    case 'trialing':
      return 'active';
    case 'past_due':
    case 'unpaid':
    case 'paused':
      return 'past_due';
    case 'canceled':
    case 'incomplete_expired':
      return 'cancelled';
    default:
      return 'incomplete';
  }
}

function paidInvoiceOf(invoice: Stripe.Invoice): PaidInvoice {
  const payment = invoice.payments?.data.find((entry) => entry.status === 'paid');
  return { id: invoice.id, amountPaidCents: invoice.amount_paid, currency: invoice.currency, paymentIntentId: idOf(payment?.payment.payment_intent) };
}

/**
 * What the payment service owns on a subscription: its standing, ids and paid period. The status
 * keeps the subscriber's pause (`subscriptionStatusOf`), so a late or out-of-order event never
 * undoes it; pause, skips, level and cadence are never written here.
 */
function billingOf(stripeSubscription: Stripe.Subscription, subscription: { pausedUntil: string | null }, today: string) {
  const periodEnds = stripeSubscription.items.data.map((item) => item.current_period_end);
  const standing = paymentStandingOf(stripeSubscription);
  return {
    status: subscriptionStatusOf(standing, subscription.pausedUntil, today),
    stripeSubscriptionId: stripeSubscription.id,
    stripeCustomerId: idOf(stripeSubscription.customer),
    currentPeriodEnd: periodEnds.length > 0 ? fromUnix(Math.max(...periodEnds)) : null,
    cancelledAt: standing === 'cancelled' ? fromUnix(stripeSubscription.ended_at ?? stripeSubscription.canceled_at) : null,
  };
}

async function greenShipDate(tx: PaymentsTransaction, paidAt: Date): Promise<string> {
  const { settings } = await loadShopSettings(tx.tx);
  const overrides = await loadCalendarOverrides(tx.tx, localDateOf(paidAt, settings.timeZone));
  return greenOrderDates(paidAt, settings, { overrides }).shipDate;
}

/**
 * Applies Stripe's webhooks. Each event id is claimed in the payment_events ledger in the same
 * transaction as its effect, so a redelivered event changes nothing. Events arrive in any order, so
 * each handler re-reads the object from Stripe and applies its current state, not the event's copy.
 */
export function createPaymentEventsService({ repo, ports, gateway, clock, logger, config, enqueueEvent }: PaymentEventsDeps) {
  const { cancelUnpaidOrder, recordPaidCycle, holdUnpaidCycle } = ports;
  const baseUrl = publicBaseUrl(config);
  const shopToday = async () => localDateOf(clock.now(), (await repo.shopTimeZone()) ?? 'UTC');

  async function completeOrderCheckout(session: Stripe.Checkout.Session): Promise<Effect | undefined> {
    const orderId = session.metadata?.[orderIdKey] ?? session.client_reference_id;
    if (!orderId || !uuidPattern.test(orderId)) {
      logger.warn({ checkoutSessionId: session.id }, 'a paid Checkout Session names no Restday order');
      return undefined;
    }
    const paymentIntentId = idOf(session.payment_intent);
    return async (tx) => {
      const order = await tx.lockOrder(orderId);
      if (!order) return void logger.warn({ orderId, checkoutSessionId: session.id }, 'a paid Checkout Session names an unknown order');
      if (order.status !== 'pending_payment') return;
      if (session.amount_total !== order.totalCents || session.currency !== order.currency) {
        logger.error(
          { orderId, charged: session.amount_total, currency: session.currency, totalCents: order.totalCents },
          'the amount paid differs from the order total; the order is left unpaid for staff to check',
        );
        return;
      }
      // A refund can arrive before the payment it refunds; an order refunded in full is never confirmed.
      const refundedInFull = order.refundedCents >= order.totalCents;
      const paidAt = clock.now();
      // A green order ships on the first ship day from payment (the next one after the cutoff).
      const shipDate = order.kind === 'green' && !refundedInFull ? await greenShipDate(tx, paidAt) : undefined;
      await tx.markOrderPaid(order.id, {
        status: refundedInFull ? 'refunded' : 'paid',
        paidAt,
        checkoutSessionId: session.id,
        paymentIntentId,
        ...(shipDate ? { shipDate } : {}),
      });
      if (refundedInFull) return;
      const confirmedShipDate = shipDate ?? order.shipDate;
      const lines = await tx.orderLines(order.id);
      await queueEmail(tx.tx, {
        template: 'order-confirmed',
        to: order.customerEmail,
        dedupeKey: `order-confirmed:${order.id}`,
        payload: {
          name: order.customerName,
          orderId: order.id,
          kind: order.kind,
          lines: lines.map((line) => ({
            description: line.description,
            size: line.size,
            quantity: line.quantity,
            lineTotalCents: line.lineTotalCents,
            ...(line.roastLevel ? { roastLevel: line.roastLevel } : {}),
            ...(line.grind ? { grind: line.grind } : {}),
          })),
          subtotalCents: order.subtotalCents,
          shippingCents: order.shippingCents,
          totalCents: order.totalCents,
          currency: order.currency,
          shipTo: order.shippingAddress,
          ...(order.roastDate ? { roastDate: order.roastDate } : {}),
          ...(confirmedShipDate ? { shipDate: confirmedShipDate } : {}),
        },
      });
    };
  }

  /** An unpaid order's checkout ran out: the order is cancelled and the stock reserved for it goes back. */
  function expireOrderCheckout(session: Stripe.Checkout.Session): Effect | undefined {
    const orderId = session.metadata?.[orderIdKey] ?? session.client_reference_id;
    if (!orderId || !uuidPattern.test(orderId)) return undefined;
    return async (tx) => {
      const order = await tx.lockOrder(orderId);
      // Only the order's current session counts: an older one may expire after a newer one was opened.
      if (!order || order.stripeCheckoutSessionId !== session.id) return;
      await cancelUnpaidOrder(tx.tx, order.id, clock.now(), `checkout ${session.id} expired`);
    };
  }

  async function completeSubscriptionCheckout(session: Stripe.Checkout.Session): Promise<Effect | undefined> {
    const subscriptionId = session.metadata?.[subscriptionIdKey] ?? session.client_reference_id;
    const stripeSubscriptionId = idOf(session.subscription);
    if (!subscriptionId || !uuidPattern.test(subscriptionId) || !stripeSubscriptionId) {
      logger.warn({ checkoutSessionId: session.id }, 'a paid subscription Checkout Session names no Restday subscription');
      return undefined;
    }
    const stripeSubscription = await gateway.retrieveSubscription(stripeSubscriptionId);
    const invoiceId = idOf(session.invoice);
    const firstInvoice = invoiceId ? await gateway.retrieveInvoice(invoiceId) : undefined;
    return async (tx) => {
      const subscription = await tx.lockSubscription(subscriptionId);
      if (!subscription) return void logger.warn({ subscriptionId }, 'a paid Checkout Session names an unknown subscription');
      await tx.updateSubscriptionBilling(subscription.id, {
        ...billingOf(stripeSubscription, subscription, await shopToday()),
        stripeCheckoutSessionId: session.id,
      });
      // The first delivery's order, whichever of this event and the first invoice.paid arrives first.
      if (firstInvoice?.status === 'paid') await recordPaidCycle(tx.tx, subscription.id, paidInvoiceOf(firstInvoice), clock.now(), logger);
      const firstRoastDate = await tx.firstDeliveryRoastDate(subscription.id);
      await queueEmail(tx.tx, {
        template: 'subscription-started',
        to: subscription.customerEmail,
        dedupeKey: `subscription-started:${subscription.id}`,
        payload: {
          name: subscription.customerName,
          subscriptionId: subscription.id,
          coffee: subscription.coffee,
          size: roastedSizeOf(subscription.bagSize),
          roastLevel: subscription.roastLevel,
          grind: subscription.grind,
          brewMethod: subscription.brewMethod,
          cadenceWeeks: subscription.cadenceWeeks,
          priceCents: subscription.priceCents,
          currency: subscription.currency,
          ...(firstRoastDate ? { firstRoastDate } : {}),
        },
      });
    };
  }

  /** The Restday subscription a Stripe subscription belongs to: by the metadata set at checkout, else by its id. */
  async function restdaySubscriptionOf(stripeSubscription: Stripe.Subscription): Promise<string | undefined> {
    const fromMetadata = stripeSubscription.metadata?.[subscriptionIdKey];
    if (fromMetadata && uuidPattern.test(fromMetadata)) return fromMetadata;
    return repo.findSubscriptionIdByStripeId(stripeSubscription.id);
  }

  async function syncSubscription(
    stripeSubscriptionId: string,
    then?: (tx: PaymentsTransaction, subscription: SubscriptionForPayment) => Promise<void>,
  ): Promise<Effect | undefined> {
    const stripeSubscription = await gateway.retrieveSubscription(stripeSubscriptionId);
    const subscriptionId = await restdaySubscriptionOf(stripeSubscription);
    if (!subscriptionId) {
      logger.warn({ stripeSubscriptionId }, 'a Stripe subscription that is not Restday’s');
      return undefined;
    }
    return async (tx) => {
      const subscription = await tx.lockSubscription(subscriptionId);
      if (!subscription) return void logger.warn({ subscriptionId }, 'a Stripe subscription names an unknown subscription');
      await tx.updateSubscriptionBilling(subscription.id, billingOf(stripeSubscription, subscription, await shopToday()));
      await then?.(tx, subscription);
    };
  }

  async function invoiceEvent(event: Stripe.Event, outcome: 'paid' | 'failed'): Promise<Effect | undefined> {
    const invoice = await gateway.retrieveInvoice(idOf(event.data.object as Stripe.Invoice) ?? '');
    const stripeSubscriptionId = idOf(invoice.parent?.subscription_details?.subscription);
    if (!stripeSubscriptionId) return undefined;
    const timeZone = (await repo.shopTimeZone()) ?? 'UTC';
    return syncSubscription(stripeSubscriptionId, async (tx, subscription) => {
      if (outcome === 'paid') {
        // Each paid invoice is one delivery's order (a held one is released to it); a second delivery of the event finds the order made.
        if (invoice.status === 'paid') await recordPaidCycle(tx.tx, subscription.id, paidInvoiceOf(invoice), clock.now(), logger);
        return;
      }
      // Only while the invoice is still unpaid: a later payment may have been delivered first.
      if (invoice.status !== 'open') return;
      await holdUnpaidCycle(tx.tx, subscription.id, clock.now());
      const nextAttempt = fromUnix(invoice.next_payment_attempt);
      await queueEmail(tx.tx, {
        template: 'payment-failed',
        to: subscription.customerEmail,
        dedupeKey: `payment-failed:${invoice.id}`,
        payload: {
          name: subscription.customerName,
          amountCents: invoice.amount_due,
          currency: invoice.currency,
          subscriptionId: subscription.id,
          updatePaymentUrl: `${baseUrl}/account`,
          ...(nextAttempt ? { nextAttemptOn: localDateOf(nextAttempt, timeZone) } : {}),
        },
      });
    });
  }

  async function chargeRefunded(event: Stripe.Event): Promise<Effect | undefined> {
    const charge = await gateway.retrieveCharge(idOf(event.data.object as Stripe.Charge) ?? '');
    const paymentIntentId = idOf(charge.payment_intent);
    if (!paymentIntentId) return undefined;
    const orderId = (await repo.findOrderIdByPaymentIntent(paymentIntentId)) ?? (await gateway.retrievePaymentIntent(paymentIntentId)).metadata?.[orderIdKey];
    if (!orderId || !uuidPattern.test(orderId)) {
      logger.warn({ chargeId: charge.id }, 'a refunded charge names no Restday order');
      return undefined;
    }
    return async (tx) => {
      const order = await tx.lockOrder(orderId);
      if (!order) return;
      // Stripe's amount_refunded is the running total, so applying it in any order lands on the same figure.
      const refundedCents = Math.min(order.totalCents, Math.max(order.refundedCents, charge.amount_refunded));
      const refundedInFull = refundedCents >= order.totalCents && order.status !== 'pending_payment';
      await tx.setOrderRefund(order.id, { refundedCents, status: refundedInFull ? 'refunded' : order.status, paymentIntentId, at: clock.now() });
    };
  }

  const handlers: Partial<Record<string, (event: Stripe.Event) => Promise<Effect | undefined>>> = {
    async 'checkout.session.completed'(event) {
      const session = await gateway.retrieveCheckoutSession(idOf(event.data.object as Stripe.Checkout.Session) ?? '');
      if (session.status !== 'complete' || session.payment_status === 'unpaid') return undefined;
      return session.mode === 'subscription' ? completeSubscriptionCheckout(session) : completeOrderCheckout(session);
    },
    async 'checkout.session.expired'(event) {
      const session = await gateway.retrieveCheckoutSession(idOf(event.data.object as Stripe.Checkout.Session) ?? '');
      return session.status === 'expired' && session.mode === 'payment' ? expireOrderCheckout(session) : undefined;
    },
    'invoice.paid': (event) => invoiceEvent(event, 'paid'),
    'invoice.payment_failed': (event) => invoiceEvent(event, 'failed'),
    'customer.subscription.updated': (event) => syncSubscription(idOf(event.data.object as Stripe.Subscription) ?? ''),
    'customer.subscription.deleted': (event) => syncSubscription(idOf(event.data.object as Stripe.Subscription) ?? ''),
    'charge.refunded': chargeRefunded,
  };

  async function effectOf(event: Stripe.Event): Promise<Effect | undefined> {
    try {
      return await handlers[event.type]?.(event);
    } catch (error) {
      // An object Stripe no longer has will never come back; retrying the event cannot help.
      if (error instanceof Stripe.errors.StripeInvalidRequestError && error.statusCode === 404) {
        logger.warn({ eventId: event.id, type: event.type, err: error }, 'a payment event names an object Stripe does not have');
        return undefined;
      }
      throw error;
    }
  }

  /**
   * Applies one received event, once: the Stripe reads first (outside any transaction, so no pool
   * connection waits on the network), then its effect and the "applied" mark in one transaction
   * that holds the inbox row. Safe to run twice or from two workers at once.
   */
  async function applyEvent(eventId: string): Promise<boolean> {
    const pending = await repo.pendingEvent(eventId);
    if (!pending) return false;
    const event = pending.payload as unknown as Stripe.Event;
    const effect = await effectOf(event);
    const applied = await repo.transaction(async (tx) => {
      if (!(await tx.claimEvent(eventId))) return false;
      await effect?.(tx);
      await tx.markEventApplied(eventId, clock.now());
      return true;
    });
    if (applied) logger.info({ eventId, type: event.type }, 'payment event applied');
    return applied;
  }

  return {
    /**
     * `POST /api/payments/webhook`: checks the signature and the event's shape, puts the event in
     * the inbox once, and answers at once; the job queue applies it (with retries), so a burst of
     * events never holds the shop's connections while it talks to Stripe.
     */
    async handleWebhook(rawBody: Buffer, signature: string | undefined): Promise<WebhookReceipt> {
      const verified = gateway.verifyWebhook(rawBody, signature);
      const shape = receivableEventSchema.safeParse(verified);
      if (!shape.success) {
        throw new AppError(400, 'invalid_webhook', 'The webhook is signed but is not a Stripe event.', {
          [shape.error.issues[0]?.path.join('.') || 'event']: shape.error.issues[0]?.message ?? 'is not an event',
        });
      }
      const payload = JSON.parse(rawBody.toString('utf8')) as Record<string, unknown>;
      const unstorable = findUnstorableText(payload);
      if (unstorable !== undefined) {
        throw new AppError(400, 'invalid_webhook', 'The event holds characters that cannot be stored.', { [unstorable]: unstorableTextMessage });
      }
      const { duplicate, applied } = await repo.receiveEvent({ id: shape.data.id, type: shape.data.type, payload });
      // An event not yet applied is queued on every delivery (the job's singleton key keeps one job),
      // and a queue that cannot take it fails the delivery: Stripe sends it again, so none waits for the sweep.
      if (!applied) {
        if (enqueueEvent) await enqueueEvent(shape.data.id);
        else await applyEvent(shape.data.id);
      }
      logger.info({ eventId: shape.data.id, type: shape.data.type, duplicate }, 'payment event received');
      return { received: true, duplicate };
    },

    applyEvent,

    /** Applies inbox events that waited longer than `graceMs` (their job was lost); returns how many. */
    async applyWaitingEvents(graceMs: number, limit = 200): Promise<number> {
      let applied = 0;
      for (const eventId of await repo.eventsWaitingSince(new Date(Date.now() - graceMs), limit)) {
        if (await applyEvent(eventId)) applied += 1;
      }
      return applied;
    },
  };
}

export type PaymentEventsService = ReturnType<typeof createPaymentEventsService>;
