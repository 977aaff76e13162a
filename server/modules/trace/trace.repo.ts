import { asc, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { bagAllocations, batches, lots, orderItems, orders, users } from '../../db/schema/index';
import { orderLineLotId } from '../../db/order-line-lot';

/** Reads for recalls: lot → batch → bag → order, both ways. */
export function createTraceRepo(db: Db) {
  return {
    async order(orderId: string) {
      const [order] = await db
        .select({
          id: orders.id,
          kind: orders.kind,
          status: orders.status,
          customerName: users.name,
          customerEmail: users.email,
          roastDate: orders.roastDate,
          shipDate: orders.shipDate,
          shippedAt: orders.shippedAt,
        })
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(eq(orders.id, orderId));
      return order;
    },

    /** The order's lines with the lot they are filled from (for Roaster's Rotation, the roast day's pick). */
    async orderLines(orderId: string) {
      return db
        .select({
          id: orderItems.id,
          lotCode: lots.code,
          lotName: lots.name,
          roastLevel: orderItems.roastLevel,
          size: orderItems.size,
          quantity: orderItems.quantity,
          fillGrams: orderItems.fillGrams,
        })
        .from(orderItems)
        .innerJoin(orders, eq(orders.id, orderItems.orderId))
        .leftJoin(lots, eq(lots.id, orderLineLotId))
        .where(eq(orderItems.orderId, orderId))
        .orderBy(asc(lots.name), desc(orderItems.fillGrams), asc(orderItems.id));
    },

    /** The order's bag allocations with the batch and the lot the batch roasted. */
    async orderAllocations(orderId: string) {
      return (
        db
          .select({
            orderItemId: bagAllocations.orderItemId,
            batchId: batches.id,
            lotCode: lots.code,
            lotName: lots.name,
            roastLevel: batches.roastLevel,
            roastDate: batches.roastDate,
            bags: bagAllocations.bags,
            grams: bagAllocations.grams,
          })
          .from(bagAllocations)
          .innerJoin(batches, eq(batches.id, bagAllocations.batchId))
          .innerJoin(lots, eq(lots.id, batches.lotId))
          .where(eq(bagAllocations.orderId, orderId))
          // Bags are filled from the oldest batch first, so this is also the order they were filled in.
          .orderBy(asc(batches.createdAt), asc(batches.id))
      );
    },

    async batch(batchId: string) {
      const [batch] = await db
        .select({
          id: batches.id,
          roastDate: batches.roastDate,
          lotCode: lots.code,
          lotName: lots.name,
          roastLevel: batches.roastLevel,
          greenGramsIn: batches.greenGramsIn,
          roastedGramsOut: batches.roastedGramsOut,
          allocatedGrams: sql<number>`(select coalesce(sum(${bagAllocations.grams}), 0)::int from ${bagAllocations} where ${bagAllocations.batchId} = ${batches.id})`,
        })
        .from(batches)
        .innerJoin(lots, eq(lots.id, batches.lotId))
        .where(eq(batches.id, batchId));
      return batch;
    },

    /** Every order the batch went into, with how many of its bags and grams each took. */
    async batchOrders(batchId: string) {
      return db
        .select({
          orderId: orders.id,
          customerName: users.name,
          customerEmail: users.email,
          status: orders.status,
          shipDate: orders.shipDate,
          shippedAt: orders.shippedAt,
          bags: sql<number>`sum(${bagAllocations.bags})::int`,
          grams: sql<number>`sum(${bagAllocations.grams})::int`,
        })
        .from(bagAllocations)
        .innerJoin(orders, eq(orders.id, bagAllocations.orderId))
        .innerJoin(users, eq(users.id, orders.userId))
        .where(eq(bagAllocations.batchId, batchId))
        .groupBy(orders.id, users.id)
        .orderBy(asc(orders.shipDate), asc(users.name), asc(orders.id));
    },
  };
}

export type TraceRepo = ReturnType<typeof createTraceRepo>;
