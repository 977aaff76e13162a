import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { lots, orders, stockMovements } from '../../db/schema/index';

export function createRefundsRepo(db: Db) {
  return {
    async findOrder(orderId: string) {
      const [order] = await db
        .select({
          id: orders.id,
          kind: orders.kind,
          status: orders.status,
          totalCents: orders.totalCents,
          refundedCents: orders.refundedCents,
          stripePaymentIntentId: orders.stripePaymentIntentId,
        })
        .from(orders)
        .where(eq(orders.id, orderId));
      return order;
    },

    /**
     * Puts an unshipped green order's coffee back on the shelf as 'refund' movements: the grams its
     * 'sale' movements still hold, per lot. Under the order's row lock, and only while the order has
     * no 'refund' movement yet, so a retried or repeated refund returns the stock exactly once.
     * Returns the grams put back.
     */
    async returnUnshippedStock(orderId: string, actorId: string): Promise<number> {
      return db.transaction(async (tx) => {
        const [order] = await tx.select({ shippedAt: orders.shippedAt, status: orders.status }).from(orders).where(eq(orders.id, orderId)).for('update');
        if (!order || order.shippedAt || order.status === 'shipped') return 0;
        const [returned] = await tx
          .select({ n: sql<number>`count(*)::int` })
          .from(stockMovements)
          .where(and(eq(stockMovements.orderId, orderId), eq(stockMovements.reason, 'refund')));
        if (returned!.n > 0) return 0;
        const held = await tx
          .select({ lotId: stockMovements.lotId, grams: sql<number>`(-sum(${stockMovements.deltaGrams}))::int` })
          .from(stockMovements)
          .where(and(eq(stockMovements.orderId, orderId), eq(stockMovements.reason, 'sale')))
          .groupBy(stockMovements.lotId)
          // Lot-id order, as checkout takes stock, so the two never deadlock.
          .orderBy(asc(stockMovements.lotId));
        let total = 0;
        for (const { lotId, grams } of held) {
          if (grams <= 0) continue;
          await tx
            .update(lots)
            .set({ stockGrams: sql`${lots.stockGrams} + ${grams}` })
            .where(eq(lots.id, lotId));
          await tx.insert(stockMovements).values({ lotId, orderId, actorId, deltaGrams: grams, reason: 'refund', note: 'refunded before shipping' });
          total += grams;
        }
        return total;
      });
    },
  };
}

export type RefundsRepo = ReturnType<typeof createRefundsRepo>;
