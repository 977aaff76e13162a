import { and, asc, count, desc, eq, gte, ilike, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { lots, orderItems, orders, shopSettings, users } from '../../db/schema/index';
import { loadShopSettings } from '../settings';
import type { OrderSort } from '@shared/schemas/orders';
import type { OrderKind, OrderStatus } from '@shared/domain/vocabulary';

export interface OrderFilters {
  /** Only this customer's orders; absent for staff, who see everyone's. */
  userId?: string;
  /** Leaves out checkouts the customer discarded (their own history; staff see every order). */
  hideDiscarded?: boolean;
  /** Part of the customer's name or e-mail, or the start of the order reference. */
  text?: string;
  status?: OrderStatus;
  kind?: OrderKind;
  roastDate?: string;
  /** Placed at or after this instant. */
  placedFrom?: Date;
  /** Placed before this instant. */
  placedBefore?: Date;
  sort: OrderSort;
}

const sortOrder: Record<OrderSort, SQL[]> = {
  newest: [desc(orders.createdAt), desc(orders.id)],
  oldest: [asc(orders.createdAt), asc(orders.id)],
  'total-high': [desc(orders.totalCents), desc(orders.createdAt)],
  'total-low': [asc(orders.totalCents), desc(orders.createdAt)],
  'roast-date-soonest': [sql`${orders.roastDate} asc nulls last`, desc(orders.createdAt)],
  'roast-date-latest': [sql`${orders.roastDate} desc nulls last`, desc(orders.createdAt)],
  // The enum's declared order is the order's life, from awaiting payment to refunded.
  status: [asc(orders.status), desc(orders.createdAt)],
};

const summaryColumns = {
  id: orders.id,
  kind: orders.kind,
  status: orders.status,
  placedAt: orders.createdAt,
  customerId: users.id,
  customerName: users.name,
  customerEmail: users.email,
  bagCount: sql<number>`(select coalesce(sum(${orderItems.quantity}), 0)::int from ${orderItems} where ${orderItems.orderId} = ${orders.id})`,
  subtotalCents: orders.subtotalCents,
  shippingCents: orders.shippingCents,
  totalCents: orders.totalCents,
  refundedCents: orders.refundedCents,
  roastDate: orders.roastDate,
  shipDate: orders.shipDate,
  carrier: orders.carrier,
  trackingNumber: orders.trackingNumber,
};

function conditionsOf(filters: Omit<OrderFilters, 'sort'>): SQL | undefined {
  const conditions: SQL[] = [];
  if (filters.userId) conditions.push(eq(orders.userId, filters.userId));
  if (filters.hideDiscarded) conditions.push(isNull(orders.discardedAt));
  if (filters.text) {
    // The search is literal: % and _ in it match themselves, not any text.
    const literal = filters.text.replace(/[\\%_]/g, (char) => `\\${char}`);
    const reference = literal.replace(/-/g, '');
    conditions.push(
      or(ilike(users.name, `%${literal}%`), ilike(users.email, `%${literal}%`), ilike(sql`replace(${orders.id}::text, '-', '')`, `${reference}%`))!,
    );
  }
  if (filters.status) conditions.push(eq(orders.status, filters.status));
  if (filters.kind) conditions.push(eq(orders.kind, filters.kind));
  if (filters.roastDate) conditions.push(eq(orders.roastDate, filters.roastDate));
  if (filters.placedFrom) conditions.push(gte(orders.createdAt, filters.placedFrom));
  if (filters.placedBefore) conditions.push(lt(orders.createdAt, filters.placedBefore));
  return conditions.length > 0 ? and(...conditions) : undefined;
}

export function createOrdersRepo(db: Db) {
  return {
    async transitDays() {
      return (await loadShopSettings(db)).settings.transitDays;
    },

    async shopTimeZone() {
      const [settings] = await db.select({ timeZone: shopSettings.timeZone }).from(shopSettings).limit(1);
      return settings?.timeZone;
    },

    /** One page of orders, and how many match across every page. `limit` absent: every match (the CSV export). */
    async list(filters: OrderFilters, page?: { limit: number; offset: number }) {
      const where = conditionsOf(filters);
      const query = db
        .select(summaryColumns)
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(where)
        .orderBy(...sortOrder[filters.sort]);
      const rows = page ? await query.limit(page.limit).offset(page.offset) : await query;
      const [total] = await db.select({ n: count() }).from(orders).innerJoin(users, eq(users.id, orders.userId)).where(where);
      return { rows, total: total!.n };
    },

    /** The order with its lines; with `userId`, only when it is that customer's (anyone else's reads as absent). */
    async find(orderId: string, userId?: string) {
      const [order] = await db
        .select({
          ...summaryColumns,
          currency: orders.currency,
          discountCents: orders.discountCents,
          subscriptionId: orders.subscriptionId,
          shippingAddress: orders.shippingAddress,
          readyFrom: orders.readyFrom,
          bestBefore: orders.bestBefore,
          paidAt: orders.paidAt,
          shippedAt: orders.shippedAt,
          cancelledAt: orders.cancelledAt,
          staffNote: orders.staffNote,
        })
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(and(eq(orders.id, orderId), userId ? eq(orders.userId, userId) : undefined));
      if (!order) return undefined;
      const items = await db
        .select({
          id: orderItems.id,
          lotCode: lots.code,
          lotName: lots.name,
          size: orderItems.size,
          quantity: orderItems.quantity,
          fillGrams: orderItems.fillGrams,
          roastLevel: orderItems.roastLevel,
          grind: orderItems.grind,
          brewMethod: orderItems.brewMethod,
          unitPriceCents: orderItems.unitPriceCents,
          lineTotalCents: orderItems.lineTotalCents,
        })
        .from(orderItems)
        .leftJoin(lots, eq(lots.id, orderItems.lotId))
        .where(eq(orderItems.orderId, order.id))
        .orderBy(asc(orderItems.id));
      return { ...order, items };
    },
  };
}

export type OrdersRepo = ReturnType<typeof createOrdersRepo>;
export type OrderRow = Awaited<ReturnType<OrdersRepo['list']>>['rows'][number];
