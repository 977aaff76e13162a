import { and, asc, eq, gte, inArray, ne, sql } from 'drizzle-orm';
import type { AddressSnapshot } from '../../db/schema/common';
import type { Db, DbOrTx } from '../../db/client';
import { lotPriceBreaks, lots, orderItems, orders, stockMovements } from '../../db/schema/index';
import type { GreenBagSize } from '@shared/domain/vocabulary';
import type { ShopSettings } from '@shared/schemas/settings';
import { loadShopSettings } from '../settings';

export interface NewGreenOrder {
  userId: string;
  subtotalCents: number;
  shippingCents: number;
  totalCents: number;
  shippingAddress: AddressSnapshot;
  /** The request's Idempotency-Key, when it sent one. */
  checkoutKey?: string;
  items: { lotId: string; size: GreenBagSize; quantity: number; fillGrams: number; unitPriceCents: number; lineTotalCents: number }[];
  /** Green grams to take from each lot for this order. */
  reservations: { lotId: string; lotCode: string; grams: number }[];
}

export interface ShortLot {
  lotCode: string;
  /** What the lot held when the order tried to take its grams. */
  stockGrams: number;
}

/** Thrown inside the order's transaction when lots cannot cover their reservations; the whole transaction rolls back. */
export class StockShortfall extends Error {
  constructor(readonly shortLots: ShortLot[]) {
    super(`Lots ${shortLots.map((lot) => lot.lotCode).join(', ')} cannot cover the order`);
    this.name = 'StockShortfall';
  }
}

/** Thrown inside the order's transaction when the buyer already has a live order under this checkout key; nothing is written. */
class CheckoutKeyTaken extends Error {}

/**
 * Puts back every gram an order still holds (its 'sale' movements net to zero afterwards), one
 * movement per lot. Run it in the transaction that cancels the order; a second run adds nothing.
 */
async function releaseOrderStock(db: DbOrTx, orderId: string, note: string) {
  const held = await db
    .select({ lotId: stockMovements.lotId, grams: sql<number>`(-sum(${stockMovements.deltaGrams}))::int` })
    .from(stockMovements)
    .where(and(eq(stockMovements.orderId, orderId), eq(stockMovements.reason, 'sale')))
    .groupBy(stockMovements.lotId)
    .orderBy(asc(stockMovements.lotId));
  for (const { lotId, grams } of held) {
    if (grams <= 0) continue;
    await db
      .update(lots)
      .set({ stockGrams: sql`${lots.stockGrams} + ${grams}` })
      .where(eq(lots.id, lotId));
    await db.insert(stockMovements).values({ lotId, orderId, deltaGrams: grams, reason: 'sale', note });
  }
}

/**
 * Cancels an order still waiting for payment and returns its reserved stock, in the caller's
 * transaction (the payments webhook calls it for `checkout.session.expired`). False when the order
 * had already moved on (paid, or cancelled before), in which case nothing changes.
 */
export async function cancelUnpaidOrder(db: DbOrTx, orderId: string, at: Date, note: string): Promise<boolean> {
  const cancelled = await db
    .update(orders)
    .set({ status: 'cancelled', cancelledAt: at })
    .where(and(eq(orders.id, orderId), eq(orders.status, 'pending_payment')))
    .returning({ id: orders.id });
  if (cancelled.length === 0) return false;
  await releaseOrderStock(db, orderId, note);
  return true;
}

export function createCheckoutRepo(db: Db) {
  /** The buyer's live (not cancelled) order placed under this checkout key, if any. */
  async function orderForCheckoutKey(userId: string, checkoutKey: string): Promise<string | undefined> {
    const [row] = await db
      .select({ id: orders.id })
      .from(orders)
      .where(and(eq(orders.userId, userId), eq(orders.checkoutKey, checkoutKey), ne(orders.status, 'cancelled')));
    return row?.id;
  }

  return {
    orderForCheckoutKey,

    /** The owner's shipping bands and tares, as GET /api/shipping gives them to the cart. */
    async shippingSettings(): Promise<ShopSettings['shipping']> {
      return (await loadShopSettings(db)).settings.shipping;
    },

    /** Listed lots by code, with their price breaks. */
    async lotsForSale(codes: string[]) {
      const rows = await db
        .select({ id: lots.id, code: lots.code, pricePerKgCents: lots.pricePerKgCents })
        .from(lots)
        .where(and(inArray(lots.code, codes), eq(lots.isListed, true)));
      const breaks =
        rows.length === 0
          ? []
          : await db
              .select({ lotId: lotPriceBreaks.lotId, minGrams: lotPriceBreaks.minGrams, pricePerKgCents: lotPriceBreaks.pricePerKgCents })
              .from(lotPriceBreaks)
              .where(
                inArray(
                  lotPriceBreaks.lotId,
                  rows.map((row) => row.id),
                ),
              );
      return rows.map((row) => ({
        ...row,
        priceBreaks: breaks.filter((priceBreak) => priceBreak.lotId === row.id).map(({ minGrams, pricePerKgCents }) => ({ minGrams, pricePerKgCents })),
      }));
    },

    /**
     * One transaction: the order, its lines, and each lot's stock taken with a conditional decrement
     * (`stock_grams >= n`, so concurrent checkouts queue on the lot's row and the loser finds it
     * short) plus its 'sale' movement. Throws StockShortfall, changing nothing, when any lot is short.
     */
    async placeGreenOrder(order: NewGreenOrder): Promise<{ orderId: string; placed: boolean }> {
      const placing = db.transaction(async (tx) => {
        const [created] = await tx
          .insert(orders)
          .values({
            userId: order.userId,
            kind: 'green',
            subtotalCents: order.subtotalCents,
            shippingCents: order.shippingCents,
            totalCents: order.totalCents,
            shippingAddress: order.shippingAddress,
            checkoutKey: order.checkoutKey ?? null,
          })
          // A concurrent request with the same key waits here for the first to commit, then finds its order.
          .onConflictDoNothing({ target: [orders.userId, orders.checkoutKey], where: sql`${orders.status} <> 'cancelled'` })
          .returning({ id: orders.id });
        if (!created) throw new CheckoutKeyTaken();
        const orderId = created.id;
        await tx.insert(orderItems).values(order.items.map((item) => ({ ...item, orderId, kind: 'green' as const })));
        // A fixed lock order (by lot id) so two multi-lot checkouts never deadlock.
        const reservations = [...order.reservations].sort((a, b) => (a.lotId < b.lotId ? -1 : a.lotId > b.lotId ? 1 : 0));
        // Every lot is tried, so the answer names each short one, not just the first.
        const shortLots: ShortLot[] = [];
        for (const { lotId, lotCode, grams } of reservations) {
          const taken = await tx
            .update(lots)
            .set({ stockGrams: sql`${lots.stockGrams} - ${grams}` })
            .where(and(eq(lots.id, lotId), gte(lots.stockGrams, grams)))
            .returning({ id: lots.id });
          if (taken.length === 0) {
            const [lot] = await tx.select({ stockGrams: lots.stockGrams }).from(lots).where(eq(lots.id, lotId));
            shortLots.push({ lotCode, stockGrams: lot?.stockGrams ?? 0 });
            continue;
          }
          await tx.insert(stockMovements).values({ lotId, orderId, actorId: order.userId, deltaGrams: -grams, reason: 'sale', note: 'reserved at checkout' });
        }
        if (shortLots.length > 0) throw new StockShortfall(shortLots);
        return orderId;
      });
      try {
        return { orderId: await placing, placed: true };
      } catch (error) {
        if (!(error instanceof CheckoutKeyTaken) || !order.checkoutKey) throw error;
        const existing = await orderForCheckoutKey(order.userId, order.checkoutKey);
        if (!existing) throw error;
        return { orderId: existing, placed: false };
      }
    },

    /** Undoes a checkout whose payment page could not be opened. */
    async cancelUnpaidOrder(orderId: string, at: Date, note: string) {
      return db.transaction((tx) => cancelUnpaidOrder(tx, orderId, at, note));
    },

    /** The customer's own order (kind and status); anyone else's reads as absent. */
    async ownOrder(userId: string, orderId: string) {
      const [row] = await db
        .select({ id: orders.id, kind: orders.kind, status: orders.status })
        .from(orders)
        .where(and(eq(orders.id, orderId), eq(orders.userId, userId)));
      return row;
    },

    /** Cancels the unpaid order, puts its stock back and leaves it out of the customer's history; false when it had moved on. */
    async discardUnpaidOrder(orderId: string, at: Date) {
      return db.transaction(async (tx) => {
        if (!(await cancelUnpaidOrder(tx, orderId, at, 'checkout discarded by the customer'))) return false;
        await tx.update(orders).set({ discardedAt: at }).where(eq(orders.id, orderId));
        return true;
      });
    },
  };
}

export type CheckoutRepo = ReturnType<typeof createCheckoutRepo>;
