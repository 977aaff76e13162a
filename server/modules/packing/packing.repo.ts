import { and, asc, desc, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { Db, DbOrTx, Tx } from '../../db/client';
import { bagAllocations, batches, deliveries, lots, orderItems, orders, users } from '../../db/schema/index';
import { roastersRotationName, type DeliveryStatus, type OrderStatus, type RoastLevel } from '@shared/domain/vocabulary';
import { loadShopSettings } from '../settings';
import { orderLineLotId } from '../../db/order-line-lot';

/** Orders a ship day's Pack List shows: paid and on their way through the roastery, or already out. */
export const packListStatuses = ['paid', 'roasted', 'packed', 'shipped'] as const satisfies readonly OrderStatus[];

const orderColumns = {
  id: orders.id,
  kind: orders.kind,
  status: orders.status,
  customerName: users.name,
  customerEmail: users.email,
  roastDate: orders.roastDate,
  shipDate: orders.shipDate,
  readyFrom: orders.readyFrom,
  bestBefore: orders.bestBefore,
  packedAt: orders.packedAt,
  shippedAt: orders.shippedAt,
  carrier: orders.carrier,
  trackingNumber: orders.trackingNumber,
};

function queries(db: DbOrTx) {
  /** Lines with the lot they are filled from: their own, or for Roaster's Rotation the lot picked for the roast day. */
  const linesOf = (orderIds: string[]) =>
    db
      .select({
        id: orderItems.id,
        orderId: orderItems.orderId,
        lotId: lots.id,
        lotCode: lots.code,
        coffee: sql<string>`coalesce(${lots.name}, ${roastersRotationName})`,
        size: orderItems.size,
        quantity: orderItems.quantity,
        fillGrams: orderItems.fillGrams,
        roastLevel: orderItems.roastLevel,
        grind: orderItems.grind,
        brewMethod: orderItems.brewMethod,
      })
      .from(orderItems)
      .innerJoin(orders, eq(orders.id, orderItems.orderId))
      .leftJoin(lots, eq(lots.id, orderLineLotId))
      .where(inArray(orderItems.orderId, orderIds))
      // Items have no position of their own: by coffee, then the larger bag first.
      .orderBy(asc(lots.name), desc(orderItems.fillGrams), asc(orderItems.id));

  async function ordersWithBags(where: SQL) {
    const found = await db
      .select(orderColumns)
      .from(orders)
      .innerJoin(users, eq(users.id, orders.userId))
      .where(where)
      .orderBy(desc(orders.kind), asc(users.name), asc(orders.id));
    if (found.length === 0) return [];
    const ids = found.map((order) => order.id);
    const [lines, allocations] = await Promise.all([
      linesOf(ids),
      db
        .select({ orderItemId: bagAllocations.orderItemId, batchId: bagAllocations.batchId, bags: bagAllocations.bags })
        .from(bagAllocations)
        .innerJoin(batches, eq(batches.id, bagAllocations.batchId))
        .where(inArray(bagAllocations.orderId, ids))
        // Bags are filled from the oldest batch first (allocateBags), so bag 1 names the oldest batch.
        .orderBy(asc(batches.createdAt), asc(batches.id)),
    ]);
    return found.map((order) => {
      const orderLines = lines.filter((line) => line.orderId === order.id);
      return {
        ...order,
        lines: orderLines.map((line) => ({ ...line, allocations: allocations.filter((allocation) => allocation.orderItemId === line.id) })),
      };
    });
  }

  return {
    async shopName() {
      return (await loadShopSettings(db)).shopName;
    },

    async shippingSettings() {
      return (await loadShopSettings(db)).settings.shipping;
    },

    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    /** The ship day's orders with their lines and bag allocations. */
    async packList(shipDate: string) {
      return ordersWithBags(and(eq(orders.shipDate, shipDate), inArray(orders.status, [...packListStatuses]))!);
    },

    async packOrder(orderId: string) {
      const [order] = await ordersWithBags(eq(orders.id, orderId));
      return order;
    },

    /** The order, locked until the transaction ends, so two packers (or two clicks) act one after the other. */
    async lockOrder(orderId: string) {
      const [order] = await db
        .select({ ...orderColumns, userId: orders.userId })
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(eq(orders.id, orderId))
        .for('update', { of: orders });
      return order;
    },

    async lines(orderId: string) {
      return linesOf([orderId]);
    },

    /**
     * The roast day's batches of these lots and levels with the roasted grams no bag has taken yet,
     * oldest first. The batches are locked (in id order, so packers never deadlock) before their
     * allocations are summed, so a second packer waits and then sees the first one's bags.
     */
    async lockBatchRoom(roastDate: string, lotLevels: { lotId: string; roastLevel: RoastLevel }[]) {
      if (lotLevels.length === 0) return [];
      const matches = lotLevels.map(({ lotId, roastLevel }) => and(eq(batches.lotId, lotId), eq(batches.roastLevel, roastLevel))!);
      const locked = await db
        .select({ id: batches.id })
        .from(batches)
        .where(and(eq(batches.roastDate, roastDate), or(...matches)))
        .orderBy(asc(batches.id))
        .for('update');
      if (locked.length === 0) return [];
      // Ordered here, not in JavaScript: created_at keeps microseconds, a Date only milliseconds.
      return db
        .select({
          batchId: batches.id,
          lotId: batches.lotId,
          roastLevel: batches.roastLevel,
          freeGrams: sql<number>`(${batches.roastedGramsOut} - coalesce(sum(${bagAllocations.grams}), 0))::int`,
        })
        .from(batches)
        .leftJoin(bagAllocations, eq(bagAllocations.batchId, batches.id))
        .where(
          inArray(
            batches.id,
            locked.map((batch) => batch.id),
          ),
        )
        .groupBy(batches.id)
        .orderBy(asc(batches.createdAt), asc(batches.id));
    },

    /** How many bags of each line of the order are already filled from a batch. */
    async filledBags(orderId: string) {
      const rows = await db
        .select({ orderItemId: bagAllocations.orderItemId, bags: sql<number>`sum(${bagAllocations.bags})::int` })
        .from(bagAllocations)
        .where(eq(bagAllocations.orderId, orderId))
        .groupBy(bagAllocations.orderItemId);
      return new Map(rows.map((row) => [row.orderItemId, row.bags]));
    },

    async insertAllocations(orderId: string, allocations: { orderItemId: string; batchId: string; bags: number; grams: number }[]) {
      if (allocations.length === 0) return;
      await db.insert(bagAllocations).values(allocations.map((allocation) => ({ ...allocation, orderId })));
    },

    async markPacked(orderId: string, packedAt: Date) {
      await db.update(orders).set({ status: 'packed', packedAt }).where(eq(orders.id, orderId));
    },

    async markShipped(orderId: string, change: { carrier: string; trackingNumber: string; shippedAt: Date }) {
      await db
        .update(orders)
        .set({ status: 'shipped', carrier: change.carrier, trackingNumber: change.trackingNumber, shippedAt: change.shippedAt })
        .where(eq(orders.id, orderId));
    },

    /** Keeps the subscriber's Deliveries in step with the order made from it. */
    async setDeliveryStatus(orderId: string, status: DeliveryStatus, from: readonly DeliveryStatus[]) {
      await db
        .update(deliveries)
        .set({ status })
        .where(and(eq(deliveries.orderId, orderId), inArray(deliveries.status, [...from])));
    },
  };
}

export type PackingQueries = ReturnType<typeof queries>;
export type PackingTransaction = PackingQueries & { tx: Tx };
export type PackListRow = NonNullable<Awaited<ReturnType<PackingQueries['packOrder']>>>;

export function createPackingRepo(db: Db) {
  return {
    ...queries(db),
    /** Runs `work` in one transaction; `tx` is for the outbox's queueEmail in the same transaction. */
    transaction<T>(work: (tx: PackingTransaction) => Promise<T>): Promise<T> {
      return db.transaction((tx) => work({ ...queries(tx), tx }));
    },
  };
}

export type PackingRepo = ReturnType<typeof createPackingRepo>;
