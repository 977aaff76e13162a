import { sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { check, date, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { users } from './accounts';
import { lots } from './catalog';
import type { AddressSnapshot } from './common';
import { instant, timestamps } from './common';
import { bagSizeEnum, brewMethodEnum, grindEnum, orderKindEnum, orderStatusEnum, roastLevelEnum } from './enums';
import { deliveries, subscriptions } from './subscriptions';

/**
 * One order: a one-time green coffee purchase (kind 'green') or one subscription delivery roasted to
 * order (kind 'roasted'). Day dates are the shop's local dates (YYYY-MM-DD); instants are UTC.
 */
export const orders = pgTable(
  'orders',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'restrict' }),
    kind: orderKindEnum('kind').notNull(),
    status: orderStatusEnum('status').notNull().default('pending_payment'),
    subscriptionId: uuid('subscription_id').references((): AnyPgColumn => subscriptions.id, { onDelete: 'set null' }),
    deliveryId: uuid('delivery_id').references((): AnyPgColumn => deliveries.id, { onDelete: 'set null' }),
    subtotalCents: integer('subtotal_cents').notNull(),
    shippingCents: integer('shipping_cents').notNull().default(0),
    /** Taken off the subtotal (a subscription delivery's discount), so total = subtotal − discount + shipping. */
    discountCents: integer('discount_cents').notNull().default(0),
    totalCents: integer('total_cents').notNull(),
    currency: text('currency').notNull().default('usd'),
    /** Where this order ships, copied at checkout. */
    shippingAddress: jsonb('shipping_address').$type<AddressSnapshot>().notNull(),
    roastDate: date('roast_date', { mode: 'string' }),
    shipDate: date('ship_date', { mode: 'string' }),
    readyFrom: date('ready_from', { mode: 'string' }),
    bestBefore: date('best_before', { mode: 'string' }),
    carrier: text('carrier'),
    trackingNumber: text('tracking_number'),
    stripeCheckoutSessionId: text('stripe_checkout_session_id'),
    /** The Idempotency-Key the buyer's checkout request carried: a retry of it finds this order, not a second one. */
    checkoutKey: text('checkout_key'),
    stripePaymentIntentId: text('stripe_payment_intent_id'),
    /** Set for subscription renewals: the Stripe invoice this order was made from (one order per invoice). */
    stripeInvoiceId: text('stripe_invoice_id'),
    paidAt: instant('paid_at'),
    packedAt: instant('packed_at'),
    shippedAt: instant('shipped_at'),
    cancelledAt: instant('cancelled_at'),
    /** Set when the customer discarded the unpaid checkout: it is cancelled and left out of their history. */
    discardedAt: instant('discarded_at'),
    /** Staff's own note on the order; never shown to the customer. */
    staffNote: text('staff_note'),
    refundedCents: integer('refunded_cents').notNull().default(0),
    /** When the latest refund was recorded: the Ledger counts refunds in the week they were made. */
    refundedAt: instant('refunded_at'),
    ...timestamps(),
  },
  (t) => [
    index('orders_user_id_created_at_idx').on(t.userId, t.createdAt),
    index('orders_status_idx').on(t.status),
    index('orders_roast_date_idx').on(t.roastDate),
    index('orders_ship_date_idx').on(t.shipDate),
    index('orders_subscription_id_idx').on(t.subscriptionId),
    uniqueIndex('orders_delivery_id_key').on(t.deliveryId),
    uniqueIndex('orders_stripe_checkout_session_id_key').on(t.stripeCheckoutSessionId),
    uniqueIndex('orders_stripe_invoice_id_key').on(t.stripeInvoiceId),
    // A cancelled order gives its key up, so a retry after a refused checkout places a new one.
    uniqueIndex('orders_user_id_checkout_key_key')
      .on(t.userId, t.checkoutKey)
      .where(sql`${t.status} <> 'cancelled'`),
    index('orders_pending_payment_created_at_idx')
      .on(t.createdAt)
      .where(sql`${t.status} = 'pending_payment'`),
    index('orders_stripe_payment_intent_id_idx').on(t.stripePaymentIntentId),
    // The Ledger's weekly sums read paid orders by payment time, and refunds by refund time.
    index('orders_paid_at_idx')
      .on(t.paidAt)
      .where(sql`${t.paidAt} is not null`),
    index('orders_refunded_at_idx')
      .on(t.refundedAt)
      .where(sql`${t.refundedAt} is not null`),
    check('orders_subtotal_non_negative', sql`${t.subtotalCents} >= 0`),
    check('orders_shipping_non_negative', sql`${t.shippingCents} >= 0`),
    check('orders_total_non_negative', sql`${t.totalCents} >= 0`),
    check('orders_discount_within_subtotal', sql`${t.discountCents} >= 0 and ${t.discountCents} <= ${t.subtotalCents}`),
    check('orders_total_adds_up', sql`${t.totalCents} = ${t.subtotalCents} - ${t.discountCents} + ${t.shippingCents}`),
    check('orders_refunded_within_total', sql`${t.refundedCents} >= 0 and ${t.refundedCents} <= ${t.totalCents}`),
    check('orders_currency_code', sql`${t.currency} ~ '^[a-z]{3}$'`),
    check('orders_green_has_no_subscription', sql`${t.kind} = 'roasted' or (${t.subscriptionId} is null and ${t.deliveryId} is null)`),
    check('orders_ship_not_before_roast', sql`${t.shipDate} is null or ${t.roastDate} is null or ${t.shipDate} >= ${t.roastDate}`),
  ],
);

/**
 * One line of an order. Green lines name a lot; roasted lines carry the roast level, grind and brew
 * method. A roasted line for Roaster's Rotation has lotId null: the lot is the rotation pick for the
 * order's roast date (rotation_picks), and the bag allocations record what was really roasted.
 * fillGrams is the bag size's declared quantity rounded up to a whole gram, so no bag is ever short.
 */
export const orderItems = pgTable(
  'order_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    orderId: uuid('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'restrict' }),
    kind: orderKindEnum('kind').notNull(),
    size: bagSizeEnum('size').notNull(),
    quantity: integer('quantity').notNull(),
    fillGrams: integer('fill_grams').notNull(),
    roastLevel: roastLevelEnum('roast_level'),
    grind: grindEnum('grind'),
    brewMethod: brewMethodEnum('brew_method'),
    unitPriceCents: integer('unit_price_cents').notNull(),
    lineTotalCents: integer('line_total_cents').notNull(),
  },
  (t) => [
    index('order_items_order_id_idx').on(t.orderId),
    index('order_items_lot_id_idx').on(t.lotId),
    check('order_items_quantity_positive', sql`${t.quantity} > 0`),
    check('order_items_fill_grams_positive', sql`${t.fillGrams} > 0`),
    check(
      'order_items_fill_grams_matches_size',
      sql`${t.fillGrams} = case ${t.size} when '8oz' then 227 when '12oz' then 341 when '1lb' then 454 when '2lb' then 908 when '5lb' then 2268 end`,
    ),
    check('order_items_unit_price_non_negative', sql`${t.unitPriceCents} >= 0`),
    check('order_items_line_total', sql`${t.lineTotalCents} = ${t.unitPriceCents} * ${t.quantity}`),
    check(
      'order_items_green_shape',
      sql`${t.kind} <> 'green' or (${t.lotId} is not null and ${t.roastLevel} is null and ${t.grind} is null and ${t.size} in ('8oz', '1lb', '2lb', '5lb'))`,
    ),
    check(
      'order_items_roasted_shape',
      sql`${t.kind} <> 'roasted' or (${t.roastLevel} is not null and ${t.grind} is not null and ${t.brewMethod} is not null and ${t.size} in ('12oz', '1lb', '2lb'))`,
    ),
  ],
);
