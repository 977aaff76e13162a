import { and, asc, between, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { emailOutbox, lots, orderItems, orders, users } from '../../db/schema/index';
import { roastersRotationName } from '@shared/domain/vocabulary';
import { queueEmail, type QueuedEmail } from '../outbox';
import { loadShopSettings } from '../settings';
import { orderLineLotId } from '../../db/order-line-lot';

export const restDayDedupeKey = (orderId: string) => `rest-day:${orderId}`;

export function createRestDayRepo(db: Db) {
  return {
    async shopTimeZone() {
      return (await loadShopSettings(db)).settings.timeZone;
    },

    /**
     * Shipped roasted orders whose ready-from date falls in [from, to] and whose rest-day e-mail is
     * not in the outbox yet, with the coffee and brew method of their first line.
     */
    async ordersDue(from: string, to: string) {
      const due = await db
        .select({
          id: orders.id,
          readyFrom: orders.readyFrom,
          bestBefore: orders.bestBefore,
          shippedAt: orders.shippedAt,
          customerName: users.name,
          customerEmail: users.email,
        })
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(
          and(
            eq(orders.kind, 'roasted'),
            eq(orders.status, 'shipped'),
            between(orders.readyFrom, from, to),
            sql`not exists (select 1 from ${emailOutbox} where ${emailOutbox.dedupeKey} = 'rest-day:' || ${orders.id}::text)`,
          ),
        )
        .orderBy(asc(orders.readyFrom), asc(orders.id));
      if (due.length === 0) return [];
      const lines = await db
        .select({
          orderId: orderItems.orderId,
          coffee: sql<string>`coalesce(${lots.name}, ${roastersRotationName})`,
          brewMethod: orderItems.brewMethod,
        })
        .from(orderItems)
        .innerJoin(orders, eq(orders.id, orderItems.orderId))
        .leftJoin(lots, eq(lots.id, orderLineLotId))
        .where(
          inArray(
            orderItems.orderId,
            due.map((order) => order.id),
          ),
        )
        .orderBy(asc(orderItems.id));
      return due.map((order) => ({ ...order, lines: lines.filter((line) => line.orderId === order.id) }));
    },

    /**
     * Queues the e-mail if the order is still shipped once it is locked (a cancellation or refund
     * committed since the read wins). Returns whether it was queued.
     */
    async queueIfStillShipped(orderId: string, email: QueuedEmail<'rest-day'>): Promise<boolean> {
      return db.transaction(async (tx) => {
        const [order] = await tx.select({ status: orders.status }).from(orders).where(eq(orders.id, orderId)).for('update');
        if (order?.status !== 'shipped') return false;
        await queueEmail(tx, email);
        return true;
      });
    },
  };
}

export type RestDayRepo = ReturnType<typeof createRestDayRepo>;
