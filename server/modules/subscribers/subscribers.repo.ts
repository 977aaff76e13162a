import { and, asc, count, desc, eq, gte, ilike, inArray, isNull, ne, or, sql, type SQL } from 'drizzle-orm';
import type { RoastLevel, SubscriptionStatus } from '@shared/domain/vocabulary';
import type { SubscriberSort } from '@shared/schemas/subscribers';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../../db/client';
import { deliveries, lots, orderItems, orders, rotationPicks, subscriptions, users } from '../../db/schema/index';
import { loadShopSettings } from '../settings/settings.repo';

export interface SubscriberFilters {
  status?: SubscriptionStatus;
  level?: RoastLevel;
  cadenceWeeks?: number;
  /** A lot code, or `{rotation: true}` for the Roaster's Rotation. */
  lot?: { code: string } | { rotation: true };
  q?: string;
  sort: SubscriberSort;
  /** Shop-local today: the next roast date is the first scheduled delivery on or after it. */
  today: string;
}

/** Deliveries still to roast for the subscriber (a held one roasts once paid). */
const upcomingStatuses = ['scheduled', 'held'] as const;

const nextRoastDate = (today: string) =>
  sql<string | null>`(select min(${deliveries.roastDate})::text from ${deliveries} where ${and(
    eq(deliveries.subscriptionId, subscriptions.id),
    inArray(deliveries.status, [...upcomingStatuses]),
    gte(deliveries.roastDate, today),
  )})`;

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

function summaryColumns(today: string) {
  return {
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
    nextRoastDate: nextRoastDate(today),
    createdAt: subscriptions.createdAt,
  };
}

function sortOrder(sort: SubscriberSort, today: string): SQL[] {
  switch (sort) {
    case 'newest':
      return [desc(subscriptions.createdAt), desc(subscriptions.id)];
    case 'oldest':
      return [asc(subscriptions.createdAt), asc(subscriptions.id)];
    case 'name':
      return [asc(users.name), asc(subscriptions.id)];
    case 'next-roast':
      return [sql`${nextRoastDate(today)} asc nulls last`, asc(subscriptions.id)];
  }
}

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
    async shopTimeZone() {
      return (await loadShopSettings(db)).settings.timeZone;
    },

    /** One page of subscriptions, and how many match across every page. `page` absent: every match (the CSV export). */
    async list(filters: SubscriberFilters, page?: { limit: number; offset: number }) {
      const where = conditionsOf(filters);
      const query = db
        .select(summaryColumns(filters.today))
        .from(subscriptions)
        .innerJoin(users, eq(users.id, subscriptions.userId))
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(where)
        .orderBy(...sortOrder(filters.sort, filters.today));
      const rows = page ? await query.limit(page.limit).offset(page.offset) : await query;
      const [total] = await db
        .select({ n: count() })
        .from(subscriptions)
        .innerJoin(users, eq(users.id, subscriptions.userId))
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(where);
      return { rows, total: total!.n };
    },

    /** A subscription with its customer, its materialized deliveries (with the order each became) and its orders. */
    async find(subscriptionId: string, today: string) {
      const [subscription] = await db
        .select({
          ...summaryColumns(today),
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
export type SubscriberRow = Awaited<ReturnType<SubscribersRepo['list']>>['rows'][number];
export type SubscriberRecord = NonNullable<Awaited<ReturnType<SubscribersRepo['find']>>>;
