import { sql } from 'drizzle-orm';
import { boolean, check, date, index, integer, jsonb, numeric, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { defaultLossModel, type LossModel } from '../../../shared/domain/roast-loss';
import { defaultShopSettings, type ShopSettings } from '../../../shared/schemas/settings';
import { users } from './accounts';
import { lots } from './catalog';
import { instant, timestamps } from './common';
import { roastLevelEnum } from './enums';
import { orderItems, orders } from './orders';

/**
 * The shop's settings: exactly one row (id = 1). Weekdays are ISO numbers (1 = Monday … 7 = Sunday)
 * in the shop's time zone. Column defaults are the shop's starting settings (defaultShopSettings)
 * and the default roast loss model.
 */
export const shopSettings = pgTable(
  'shop_settings',
  {
    id: integer('id').primaryKey().default(1),
    shopName: text('shop_name').notNull(),
    /** IANA zone, e.g. America/Denver. */
    timeZone: text('time_zone').notNull(),
    roastWeekdays: integer('roast_weekdays')
      .array()
      .notNull()
      .default(sql`'{2,4}'::integer[]`),
    /** Order cutoff, shop-local 'HH:MM', cutoffDaysBefore days before the roast day. */
    cutoffTime: text('cutoff_time').notNull().default('12:00'),
    cutoffDaysBefore: integer('cutoff_days_before').notNull().default(1),
    shipWeekdays: integer('ship_weekdays')
      .array()
      .notNull()
      .default(sql`'{1,2,3,4,5}'::integer[]`),
    transitDays: integer('transit_days').notNull().default(3),
    /** Days after roasting before a bag may ship (degassing in the bag). */
    degasHoldDays: integer('degas_hold_days').notNull().default(1),
    restDaysFilter: integer('rest_days_filter').notNull().default(2),
    restDaysEspresso: integer('rest_days_espresso').notNull().default(7),
    bestBeforeDays: integer('best_before_days').notNull().default(28),
    overagePct: numeric('overage_pct', { precision: 5, scale: 2, mode: 'number' }).notNull().default(3),
    /** Rated batch capacity of the roaster (green grams per batch). */
    roasterCapacityGrams: integer('roaster_capacity_grams').notNull().default(6000),
    minLoadPct: integer('min_load_pct').notNull().default(50),
    maxLoadPct: integer('max_load_pct').notNull().default(80),
    /** Green grams the roastery can roast on an open roast day unless roast_days overrides it. */
    dailyCapacityGrams: integer('daily_capacity_grams').notNull().default(48000),
    lossModel: jsonb('loss_model').$type<LossModel>().notNull().default(defaultLossModel),
    lossModelMinBatches: integer('loss_model_min_batches').notNull().default(defaultShopSettings.lossModelMinBatches),
    currency: text('currency').notNull().default(defaultShopSettings.currency),
    /** Days added to the brew method's rest per roast level. */
    restAdjustDays: jsonb('rest_adjust_days').$type<ShopSettings['restAdjustDays']>().notNull().default(defaultShopSettings.restAdjustDays),
    roastedBagPriceCents: jsonb('roasted_bag_price_cents')
      .$type<ShopSettings['roastedBagPriceCents']>()
      .notNull()
      .default(defaultShopSettings.roastedBagPriceCents),
    subscriptionDiscountPct: numeric('subscription_discount_pct', { precision: 5, scale: 2, mode: 'number' })
      .notNull()
      .default(defaultShopSettings.subscriptionDiscountPct),
    shipPolicy: text('ship_policy').$type<ShopSettings['shipPolicy']>().notNull().default(defaultShopSettings.shipPolicy),
    holdOverWeekend: boolean('hold_over_weekend').notNull().default(defaultShopSettings.holdOverWeekend),
    renewalReminderDays: integer('renewal_reminder_days').notNull().default(defaultShopSettings.renewalReminderDays),
    shipping: jsonb('shipping').$type<ShopSettings['shipping']>().notNull().default(defaultShopSettings.shipping),
    /** The street address bag labels print under the shop's name; null until the owner enters it. */
    placeOfBusiness: jsonb('place_of_business').$type<ShopSettings['placeOfBusiness']>(),
    carriers: jsonb('carriers').$type<ShopSettings['carriers']>().notNull().default(defaultShopSettings.carriers),
    updatedAt: instant('updated_at')
      .notNull()
      .defaultNow()
      .$onUpdate(() => new Date()),
  },
  (t) => [
    check('shop_settings_single_row', sql`${t.id} = 1`),
    check('shop_settings_roast_weekdays_iso', sql`${t.roastWeekdays} <@ array[1,2,3,4,5,6,7]`),
    check('shop_settings_ship_weekdays_iso', sql`${t.shipWeekdays} <@ array[1,2,3,4,5,6,7] and cardinality(${t.shipWeekdays}) > 0`),
    check('shop_settings_cutoff_time_format', sql`${t.cutoffTime} ~ '^([01][0-9]|2[0-3]):[0-5][0-9]$'`),
    check('shop_settings_cutoff_days_before_range', sql`${t.cutoffDaysBefore} between 0 and 14`),
    check('shop_settings_transit_days_range', sql`${t.transitDays} between 0 and 30`),
    check('shop_settings_degas_hold_days_range', sql`${t.degasHoldDays} between 0 and 30`),
    check('shop_settings_rest_days_range', sql`${t.restDaysFilter} between 0 and 60 and ${t.restDaysEspresso} between 0 and 60`),
    check('shop_settings_best_before_days_range', sql`${t.bestBeforeDays} between 1 and 365`),
    check('shop_settings_overage_pct_range', sql`${t.overagePct} >= 0 and ${t.overagePct} <= 50`),
    check('shop_settings_roaster_capacity_positive', sql`${t.roasterCapacityGrams} > 0`),
    check('shop_settings_load_pct_range', sql`${t.minLoadPct} > 0 and ${t.minLoadPct} <= ${t.maxLoadPct} and ${t.maxLoadPct} <= 100`),
    check('shop_settings_daily_capacity_non_negative', sql`${t.dailyCapacityGrams} >= 0`),
    check('shop_settings_loss_model_min_batches_range', sql`${t.lossModelMinBatches} between 1 and 100`),
    check('shop_settings_currency_code', sql`${t.currency} ~ '^[a-z]{3}$'`),
    check('shop_settings_subscription_discount_range', sql`${t.subscriptionDiscountPct} >= 0 and ${t.subscriptionDiscountPct} <= 50`),
    check('shop_settings_ship_policy', sql`${t.shipPolicy} in ('ready_on_arrival', 'after_degassing')`),
    check('shop_settings_renewal_reminder_days_range', sql`${t.renewalReminderDays} between 0 and 14`),
  ],
);

/** Roast Calendar overrides: a closure (open = false) or a different capacity on one date. */
export const roastDays = pgTable(
  'roast_days',
  {
    date: date('date', { mode: 'string' }).primaryKey(),
    open: boolean('open').notNull(),
    /** Whether parcels go out this day; null follows the ship weekdays and carrier holidays. */
    shipOpen: boolean('ship_open'),
    /** Green grams for this day; null = the shop's dailyCapacityGrams. */
    capacityGrams: integer('capacity_grams'),
    note: text('note').notNull().default(''),
    ...timestamps(),
  },
  (t) => [check('roast_days_capacity_non_negative', sql`${t.capacityGrams} is null or ${t.capacityGrams} >= 0`)],
);

/** One roasted batch as recorded by staff. lossPct = (in − out) ÷ in × 100. */
export const batches = pgTable(
  'batches',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    roastDate: date('roast_date', { mode: 'string' }).notNull(),
    lotId: uuid('lot_id')
      .notNull()
      .references(() => lots.id, { onDelete: 'restrict' }),
    roastLevel: roastLevelEnum('roast_level').notNull(),
    greenGramsIn: integer('green_grams_in').notNull(),
    roastedGramsOut: integer('roasted_grams_out').notNull(),
    totalSeconds: integer('total_seconds'),
    firstCrackSeconds: integer('first_crack_seconds'),
    operatorId: uuid('operator_id').references(() => users.id, { onDelete: 'set null' }),
    lossPct: numeric('loss_pct', { precision: 5, scale: 2, mode: 'number' }).notNull(),
    withinExpected: boolean('within_expected').notNull(),
    notes: text('notes').notNull().default(''),
    createdAt: instant('created_at').notNull().defaultNow(),
  },
  (t) => [
    index('batches_lot_id_roast_level_idx').on(t.lotId, t.roastLevel),
    index('batches_roast_date_idx').on(t.roastDate),
    check('batches_green_grams_in_positive', sql`${t.greenGramsIn} > 0`),
    check('batches_roasted_grams_out_positive', sql`${t.roastedGramsOut} > 0`),
    check('batches_roasted_less_than_green', sql`${t.roastedGramsOut} < ${t.greenGramsIn}`),
    check('batches_total_seconds_positive', sql`${t.totalSeconds} is null or ${t.totalSeconds} > 0`),
    check(
      'batches_first_crack_within_roast',
      sql`${t.firstCrackSeconds} is null or (${t.firstCrackSeconds} > 0 and (${t.totalSeconds} is null or ${t.firstCrackSeconds} < ${t.totalSeconds}))`,
    ),
    check('batches_loss_pct_range', sql`${t.lossPct} > 0 and ${t.lossPct} < 100`),
  ],
);

/** Bags of an order line filled from a batch: the link that makes lot → batch → bag → order traceable. */
export const bagAllocations = pgTable(
  'bag_allocations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    batchId: uuid('batch_id')
      .notNull()
      .references(() => batches.id, { onDelete: 'restrict' }),
    orderItemId: uuid('order_item_id')
      .notNull()
      .references(() => orderItems.id, { onDelete: 'cascade' }),
    orderId: uuid('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    bags: integer('bags').notNull(),
    /** Roasted grams taken from the batch (bags × fill grams). */
    grams: integer('grams').notNull(),
    createdAt: instant('created_at').notNull().defaultNow(),
  },
  (t) => [
    index('bag_allocations_batch_id_idx').on(t.batchId),
    index('bag_allocations_order_id_idx').on(t.orderId),
    index('bag_allocations_order_item_id_idx').on(t.orderItemId),
    check('bag_allocations_bags_positive', sql`${t.bags} > 0`),
    check('bag_allocations_grams_positive', sql`${t.grams} > 0`),
  ],
);
