import { and, asc, desc, eq, ilike, inArray, isNull, ne, or, sql, type SQL } from 'drizzle-orm';
import type { RoastLevel, SubscriptionStatus } from '@shared/domain/vocabulary';
import type { SubscriberSort } from '@shared/schemas/subscribers';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../../db/client';
import { deliveries, lots, orderItems, orders, rotationPicks, subscriptions, users } from '../../db/schema/index';
import { loadCalendarOverrides, loadShopSettings } from '../settings';
import { keptDeliveryColumns } from '../subscriptions';

export interface SubscriberFilters {
  status?: SubscriptionStatus;
  level?: RoastLevel;
  cadenceWeeks?: number;
  /** A lot code, or `{rotation: true}` for the Roaster's Rotation. */
  lot?: { code: string } | { rotation: true };
  q?: string;
  /** The database's part of the order; the next roast date is the delivery plan's, sorted by the service. */
  sort: Exclude<SubscriberSort, 'next-roast'>;
}

/** The lot a Roaster's Rotation delivery gets: the one picked for its roast day. */
const pickedLots = alias(lots, 'picked_lots');

const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (match) => `\\${match}`)}%`;

function conditionsOf(filters: SubscriberFilters): SQL | undefined {
  const conditions: (SQL | undefined)[] = [
    filters.status ? eq(subscriptions.status, filters.status) : ne(subscriptions.status, 'incomplete'),
    filters.level ? eq(subscriptions.roastLevel, filters.level) : undefined,
    filters.cadenceWeeks ? eq(subscriptions.cadenceWeeks, filters.cadenceWeeks) : undefined,
  ];
  if (filters.lot) conditions.push('rotation' in filters.lot ? isNull(subscriptions.lotId) : eq(lots.code, filters.lot.code));
  if (filters.q) conditions.push(or(ilike(users.name, likePattern(filters.q)), ilike(users.email, likePattern(filters.q))));
  return and(...conditions);
}

const summaryColumns = {
  id: subscriptions.id,
  customerId: users.id,
  customerName: users.name,
  email: users.email,
  status: subscriptions.status,
  lotCode: lots.code,
  lotName: lots.name,
  roastLevel: subscriptions.roastLevel,
  bagSize: subscriptions.bagSize,
  bagsPerDelivery: subscriptions.bagsPerDelivery,
  grind: subscriptions.grind,
  brewMethod: subscriptions.brewMethod,
  cadenceWeeks: subscriptions.cadenceWeeks,
  priceCents: subscriptions.priceCents,
  anchorDate: subscriptions.anchorDate,
  pausedUntil: subscriptions.pausedUntil,
  cancelAtPeriodEnd: subscriptions.cancelAtPeriodEnd,
  createdAt: subscriptions.createdAt,
};

const sortOrder: Record<SubscriberFilters['sort'], SQL[]> = {
  newest: [desc(subscriptions.createdAt), desc(subscriptions.id)],
  oldest: [asc(subscriptions.createdAt), asc(subscriptions.id)],
  name: [asc(users.name), asc(subscriptions.id)],
};

const orderColumns = {
  id: orders.id,
  status: orders.status,
  totalCents: orders.totalCents,
  placedAt: orders.createdAt,
  paidAt: orders.paidAt,
  roastDate: orders.roastDate,
  shipDate: orders.shipDate,
  carrier: orders.carrier,
  trackingNumber: orders.trackingNumber,
};

export function createSubscribersRepo(db: Db) {
  return {
    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    /** Every subscription matching the filters, in the filters' order. */
    async list(filters: SubscriberFilters) {
      return db
        .select(summaryColumns)
        .from(subscriptions)
        .innerJoin(users, eq(users.id, subscriptions.userId))
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(conditionsOf(filters))
        .orderBy(...sortOrder[filters.sort]);
    },

    /** The kept delivery rows of these subscriptions, by roast date, as the delivery plan reads them. */
    async keptDeliveries(subscriptionIds: string[]) {
      if (subscriptionIds.length === 0) return [];
      return db.select(keptDeliveryColumns).from(deliveries).where(inArray(deliveries.subscriptionId, subscriptionIds)).orderBy(asc(deliveries.roastDate));
    },

    /** Roast Calendar overrides from `from` on. */
    calendarOverrides: (from: string) => loadCalendarOverrides(db, from),

    /** A subscription with its customer, its materialized deliveries (with the order each became) and its orders. */
    async find(subscriptionId: string) {
      const [subscription] = await db
        .select({
          ...summaryColumns,
          currency: subscriptions.currency,
          pausedUntil: subscriptions.pausedUntil,
          currentPeriodEnd: subscriptions.currentPeriodEnd,
          cancelledAt: subscriptions.cancelledAt,
          shippingAddress: subscriptions.shippingAddress,
        })
        .from(subscriptions)
        .innerJoin(users, eq(users.id, subscriptions.userId))
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(eq(subscriptions.id, subscriptionId));
      if (!subscription) return undefined;
      const deliveryRows = await db
        .select({
          id: deliveries.id,
          sequence: deliveries.sequence,
          roastDate: deliveries.roastDate,
          shipDate: deliveries.shipDate,
          readyFrom: deliveries.readyFrom,
          bestBefore: deliveries.bestBefore,
          status: deliveries.status,
          orderId: deliveries.orderId,
          pickedLotCode: pickedLots.code,
          pickedLotName: pickedLots.name,
        })
        .from(deliveries)
        .leftJoin(rotationPicks, eq(rotationPicks.roastDate, deliveries.roastDate))
        .leftJoin(pickedLots, eq(pickedLots.id, rotationPicks.lotId))
        .where(eq(deliveries.subscriptionId, subscriptionId))
        .orderBy(asc(deliveries.roastDate), asc(deliveries.sequence));
      const orderRows = await db
        .select({ ...orderColumns, bags: sql<number>`coalesce(sum(${orderItems.quantity}), 0)::int` })
        .from(orders)
        .leftJoin(orderItems, eq(orderItems.orderId, orders.id))
        .where(eq(orders.subscriptionId, subscriptionId))
        .groupBy(orders.id)
        .orderBy(desc(orders.createdAt), desc(orders.id));
      return { subscription, deliveries: deliveryRows, orders: orderRows };
    },
  };
}

export type SubscribersRepo = ReturnType<typeof createSubscribersRepo>;
export type SubscriberRow = Awaited<ReturnType<SubscribersRepo['list']>>[number];
export type KeptDeliveryRow = Awaited<ReturnType<SubscribersRepo['keptDeliveries']>>[number];
export type SubscriberRecord = NonNullable<Awaited<ReturnType<SubscribersRepo['find']>>>;
