import { sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { boolean, check, date, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { users } from './accounts';
import { lots } from './catalog';
import type { AddressSnapshot } from './common';
import { instant, timestamps } from './common';
import { bagSizeEnum, brewMethodEnum, deliveryStatusEnum, grindEnum, roastLevelEnum, subscriptionStatusEnum } from './enums';
import { orders } from './orders';

/** A roast-to-order subscription. lotId null = Roaster's Rotation (staff pick the lot each roast day). */
export const subscriptions = pgTable(
  'subscriptions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'restrict' }),
    status: subscriptionStatusEnum('status').notNull().default('incomplete'),
    lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'restrict' }),
    roastLevel: roastLevelEnum('roast_level').notNull(),
    bagSize: bagSizeEnum('bag_size').notNull(),
    bagsPerDelivery: integer('bags_per_delivery').notNull().default(1),
    grind: grindEnum('grind').notNull().default('whole-bean'),
    brewMethod: brewMethodEnum('brew_method').notNull().default('filter'),
    cadenceWeeks: integer('cadence_weeks').notNull(),
    /** Shop-local date the pause ends (deliveries resume on the first roast day on or after it). */
    pausedUntil: date('paused_until', { mode: 'string' }),
    shippingAddress: jsonb('shipping_address').$type<AddressSnapshot>().notNull(),
    stripeSubscriptionId: text('stripe_subscription_id'),
    stripeCustomerId: text('stripe_customer_id'),
    /** The latest Checkout Session started for this subscription; a retry after it expires starts a new one. */
    stripeCheckoutSessionId: text('stripe_checkout_session_id'),
    /** Price of one delivery (all its bags), in cents. */
    priceCents: integer('price_cents').notNull(),
    currency: text('currency').notNull().default('usd'),
    currentPeriodEnd: instant('current_period_end'),
    cancelledAt: instant('cancelled_at'),
    /** Set when the customer discarded the unpaid checkout: it is cancelled and left out of their subscriptions. */
    discardedAt: instant('discarded_at'),
    /** When the subscriber last paused it (the Ledger's pauses per week). */
    pausedAt: instant('paused_at'),
    /** Nominal roast date of the first delivery; later ones sit every cadence on from it (re-anchored when the cadence changes). */
    anchorDate: date('anchor_date', { mode: 'string' }),
    /** The subscriber cancelled: it ends when the paid period does (Stripe's cancel_at_period_end). */
    cancelAtPeriodEnd: boolean('cancel_at_period_end').notNull().default(false),
    /** Bumped by every self-service change; Stripe holds the state of `stripeSyncedVersion`. */
    changeVersion: integer('change_version').notNull().default(0),
    stripeSyncedVersion: integer('stripe_synced_version').notNull().default(0),
    ...timestamps(),
  },
  (t) => [
    index('subscriptions_user_id_idx').on(t.userId),
    index('subscriptions_status_idx').on(t.status),
    index('subscriptions_lot_id_idx').on(t.lotId),
    uniqueIndex('subscriptions_stripe_subscription_id_key').on(t.stripeSubscriptionId),
    index('subscriptions_stripe_customer_id_idx').on(t.stripeCustomerId),
    uniqueIndex('subscriptions_stripe_checkout_session_id_key').on(t.stripeCheckoutSessionId),
    check('subscriptions_bags_per_delivery_range', sql`${t.bagsPerDelivery} between 1 and 10`),
    check('subscriptions_cadence_weeks_range', sql`${t.cadenceWeeks} between 1 and 4`),
    check('subscriptions_price_non_negative', sql`${t.priceCents} >= 0`),
    check('subscriptions_roasted_bag_size', sql`${t.bagSize} in ('12oz', '1lb', '2lb')`),
  ],
);

/**
 * One scheduled delivery of a subscription: the dates the subscriber sees on Deliveries.
 * orderId is set once the cycle is paid and becomes an order.
 */
export const deliveries = pgTable(
  'deliveries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    subscriptionId: uuid('subscription_id')
      .notNull()
      .references(() => subscriptions.id, { onDelete: 'cascade' }),
    orderId: uuid('order_id').references((): AnyPgColumn => orders.id, { onDelete: 'set null' }),
    /** 1, 2, 3 … in the subscription's order of deliveries. */
    sequence: integer('sequence').notNull(),
    roastDate: date('roast_date', { mode: 'string' }).notNull(),
    shipDate: date('ship_date', { mode: 'string' }).notNull(),
    readyFrom: date('ready_from', { mode: 'string' }).notNull(),
    bestBefore: date('best_before', { mode: 'string' }).notNull(),
    status: deliveryStatusEnum('status').notNull().default('scheduled'),
    /** Its place on the subscription's grid (anchor + n × cadence); the roast date may be later (a closure, a late payment). */
    nominalDate: date('nominal_date', { mode: 'string' }),
    // What this delivery brings, frozen once its cutoff passes or it is paid; null = the subscription's current choice.
    roastLevel: roastLevelEnum('roast_level'),
    bagSize: bagSizeEnum('bag_size'),
    bagsPerDelivery: integer('bags_per_delivery'),
    grind: grindEnum('grind'),
    brewMethod: brewMethodEnum('brew_method'),
    /** A skipped delivery whose charge Stripe has already moved one cadence on. */
    chargeDeferred: boolean('charge_deferred').notNull().default(false),
    ...timestamps(),
  },
  (t) => [
    uniqueIndex('deliveries_subscription_id_sequence_key').on(t.subscriptionId, t.sequence),
    uniqueIndex('deliveries_subscription_id_nominal_date_key').on(t.subscriptionId, t.nominalDate),
    index('deliveries_roast_date_idx').on(t.roastDate),
    uniqueIndex('deliveries_order_id_key').on(t.orderId),
    check('deliveries_sequence_positive', sql`${t.sequence} > 0`),
    check('deliveries_ship_not_before_roast', sql`${t.shipDate} >= ${t.roastDate}`),
    check('deliveries_ready_not_before_roast', sql`${t.readyFrom} >= ${t.roastDate}`),
    check('deliveries_best_before_after_ready', sql`${t.bestBefore} >= ${t.readyFrom}`),
  ],
);

/** Roaster's Rotation: the lot staff picked for a roast day. */
export const rotationPicks = pgTable('rotation_picks', {
  roastDate: date('roast_date', { mode: 'string' }).primaryKey(),
  lotId: uuid('lot_id')
    .notNull()
    .references(() => lots.id, { onDelete: 'restrict' }),
  note: text('note').notNull().default(''),
  pickedBy: uuid('picked_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps(),
});
