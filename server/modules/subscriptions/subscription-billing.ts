// What a subscription's charges do to its deliveries, run inside the payment ledger's transaction
// (server/modules/payments/payment-events.service.ts calls these; only Stripe events move money).
import { deliveryToCharge, firstRoastDates, planDeliveries, roastDatesWhenPaid } from '@shared/domain/delivery-plan';
import { BagTooHeavyForShipping } from '@shared/domain/parcel-packing';
import { quoteSubscriptionDelivery } from '@shared/domain/pricing';
import { bagFillGrams } from '@shared/domain/units';
import type { RoastedBagSize } from '@shared/domain/vocabulary';
import type { ShopSettings } from '@shared/schemas/settings';
import type { Tx } from '../../db/client';
import type { Logger } from '../../lib/logger';
import type { PaidInvoice } from '../payments';
import { keepDelivery, setAnchorDate } from './delivery-grid.repo';
import { createDeliveryOrder, findOrderIdByInvoice, linkOrderToDelivery } from './delivery-orders.repo';
import { choiceOf, keptDeliveries, loadScheduleContext, lockSubscription, type SubscriptionRecord } from './subscription-records.repo';

/** Enough deliveries ahead to find the one a charge pays for, past skips and a pause. */
const lookAhead = 26;

async function billingPlan(tx: Tx, subscription: SubscriptionRecord, now: Date) {
  const { settings, calendar } = await loadScheduleContext(tx, now);
  const kept = await keptDeliveries(tx, subscription.id);
  let anchorDate = subscription.anchorDate ?? kept[0]?.nominalDate ?? null;
  if (!anchorDate) {
    // The first charge: the first delivery roasts on the first open roast day whose cutoff is still ahead.
    anchorDate = firstRoastDates(now, subscription, settings, calendar).roastDate;
    await setAnchorDate(tx, subscription.id, anchorDate);
  }
  const plan = planDeliveries(
    {
      // A charge Stripe has taken is delivered, whatever the subscription's state says now.
      status: subscription.status === 'cancelled' || subscription.status === 'incomplete' ? 'active' : subscription.status,
      anchorDate,
      cadenceWeeks: subscription.cadenceWeeks,
      pausedUntil: subscription.pausedUntil,
      cancelAtPeriodEnd: false,
      choice: choiceOf(subscription),
    },
    kept,
    settings,
    calendar,
    now,
    lookAhead,
  );
  return { plan, settings, calendar };
}

/**
 * The shipping share of a paid delivery, as the one parcel plan prices it. Money already taken
 * must still become an order: if the owner has since set bands too light for one bag, the whole
 * payment counts as bags and the Pack List says the parcels are the packer's to make.
 */
function deliveryShippingCents(
  subscription: { id: string; lotCode: string | null },
  choice: { bagSize: RoastedBagSize; bagsPerDelivery: number },
  settings: ShopSettings,
  logger: Logger,
): number {
  try {
    return quoteSubscriptionDelivery({ lotCode: subscription.lotCode, bagSize: choice.bagSize, bagsPerDelivery: choice.bagsPerDelivery }, settings)
      .shippingCents;
  } catch (error) {
    if (!(error instanceof BagTooHeavyForShipping)) throw error;
    logger.warn({ subscriptionId: subscription.id, bagSize: choice.bagSize }, 'a paid delivery has a bag over the heaviest shipping band');
    return 0;
  }
}

/**
 * A paid invoice becomes the delivery order of the cycle it pays for (a held delivery first, else
 * the first one neither paid nor skipped), once: orders.stripe_invoice_id is unique. A delivery
 * whose cutoff has gone roasts on the next open roast day instead. Returns the order id.
 */
export async function recordPaidCycle(tx: Tx, subscriptionId: string, invoice: PaidInvoice, paidAt: Date, logger: Logger): Promise<string | undefined> {
  if (await findOrderIdByInvoice(tx, invoice.id)) return undefined;
  const subscription = await lockSubscription(tx, subscriptionId);
  if (!subscription) return undefined;
  const { plan, settings, calendar } = await billingPlan(tx, subscription, paidAt);
  const target = deliveryToCharge(plan);
  if (!target) {
    logger.error({ subscriptionId, invoiceId: invoice.id }, 'a paid invoice found no delivery to pay for');
    return undefined;
  }
  const dates = roastDatesWhenPaid(target, paidAt, settings, calendar);
  const shippingCents = Math.min(deliveryShippingCents(subscription, target.choice, settings, logger), invoice.amountPaidCents);
  const bagPriceCents = settings.roastedBagPriceCents[target.choice.bagSize];
  const bagsCents = bagPriceCents * target.choice.bagsPerDelivery;
  // The bags at list price, less what the charge took off them, so the order's lines add up to what was paid.
  const subtotalCents = Math.max(bagsCents, invoice.amountPaidCents - shippingCents);
  const discountCents = subtotalCents + shippingCents - invoice.amountPaidCents;
  const orderId = await createDeliveryOrder(tx, {
    userId: subscription.userId,
    subscriptionId,
    stripeInvoiceId: invoice.id,
    stripePaymentIntentId: invoice.paymentIntentId,
    currency: invoice.currency,
    subtotalCents,
    discountCents,
    shippingCents,
    totalCents: invoice.amountPaidCents,
    shippingAddress: subscription.shippingAddress,
    dates,
    paidAt,
    item: {
      lotId: subscription.lotId,
      size: target.choice.bagSize,
      quantity: target.choice.bagsPerDelivery,
      fillGrams: bagFillGrams(target.choice.bagSize),
      roastLevel: target.choice.roastLevel,
      grind: target.choice.grind,
      brewMethod: target.choice.brewMethod,
      unitPriceCents: bagPriceCents,
      lineTotalCents: bagsCents,
    },
  });
  if (!orderId) return undefined;
  const deliveryId = await keepDelivery(tx, subscriptionId, target, { status: 'scheduled', dates, choice: target.choice, orderId });
  await linkOrderToDelivery(tx, orderId, deliveryId);
  return orderId;
}

/** A failed charge holds the delivery it was for until it is paid. Returns false when there is none to hold. */
export async function holdUnpaidCycle(tx: Tx, subscriptionId: string, now: Date): Promise<boolean> {
  const subscription = await lockSubscription(tx, subscriptionId);
  if (!subscription) return false;
  const { plan } = await billingPlan(tx, subscription, now);
  const target = deliveryToCharge(plan);
  if (!target || target.status === 'held') return false;
  await keepDelivery(tx, subscriptionId, target, { status: 'held', dates: target, ...(target.frozen ? { choice: target.choice } : {}) });
  return true;
}
