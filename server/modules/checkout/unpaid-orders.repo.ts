import { and, asc, eq, gt, isNotNull, isNull, lt, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { orders } from '../../db/schema/index';
import { cancelUnpaidOrder } from './checkout.repo';

export interface StaleUnpaidOrder {
  id: string;
  /** As PostgreSQL writes it (to the microsecond), so reading on after it skips nothing and repeats nothing. */
  placedAt: string;
  stripeCheckoutSessionId: string | null;
}

/** How many unpaid orders one read returns; a sweep reads on after the last one until none are left. */
export const staleBatchSize = 100;

export function createUnpaidOrdersRepo(db: Db) {
  return {
    /**
     * Green orders still waiting for payment that should have moved on: placed before `noPageBefore`
     * with no payment page recorded, or placed before `pageExpiredBefore` (their first page has run out).
     * Oldest first, after `after` (the last one of the previous read).
     */
    async staleUnpaidOrders(noPageBefore: Date, pageExpiredBefore: Date, after?: StaleUnpaidOrder): Promise<StaleUnpaidOrder[]> {
      return db
        .select({ id: orders.id, placedAt: sql<string>`${orders.createdAt}::text`, stripeCheckoutSessionId: orders.stripeCheckoutSessionId })
        .from(orders)
        .where(
          and(
            eq(orders.status, 'pending_payment'),
            eq(orders.kind, 'green'),
            or(
              and(isNull(orders.stripeCheckoutSessionId), lt(orders.createdAt, noPageBefore)),
              and(isNotNull(orders.stripeCheckoutSessionId), lt(orders.createdAt, pageExpiredBefore)),
            ),
            after ? gt(sql`(${orders.createdAt}, ${orders.id})`, sql`(${after.placedAt}::timestamptz, ${after.id}::uuid)`) : undefined,
          ),
        )
        .orderBy(asc(orders.createdAt), asc(orders.id))
        .limit(staleBatchSize);
    },

    /**
     * Cancels the order and puts its stock back, in one transaction under the order's row lock, only
     * if it is still unpaid with the same payment page (or still none) as when it was looked at: a
     * checkout retry that saved a page meanwhile, a payment, or another run that got there first
     * leave it alone. True when this call cancelled it.
     */
    async cancelIfUnchanged(order: StaleUnpaidOrder, at: Date, note: string): Promise<boolean> {
      return db.transaction(async (tx) => {
        const [current] = await tx
          .select({ status: orders.status, stripeCheckoutSessionId: orders.stripeCheckoutSessionId })
          .from(orders)
          .where(eq(orders.id, order.id))
          .for('update');
        if (current?.status !== 'pending_payment' || current.stripeCheckoutSessionId !== order.stripeCheckoutSessionId) return false;
        return cancelUnpaidOrder(tx, order.id, at, note);
      });
    },
  };
}

export type UnpaidOrdersRepo = ReturnType<typeof createUnpaidOrdersRepo>;
