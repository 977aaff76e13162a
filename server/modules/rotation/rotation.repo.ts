import { and, asc, between, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { deliveries, lots, orderItems, orders, rotationPicks, subscriptions } from '../../db/schema/index';
import { loadCalendarOverrides, loadShopSettings } from '../settings';
import { keptDeliveryColumns } from '../subscriptions';

/** Orders whose coffee has been roasted already. */
const roastedOrderStatuses = ['roasted', 'packed', 'shipped'] as const;

export function createRotationRepo(db: Db) {
  return {
    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    /** Roast Calendar overrides from `from` on (a delivery's search for an open day runs past any range). */
    calendarOverrides: (from: string) => loadCalendarOverrides(db, from),

    async picks(from: string, to: string) {
      return db
        .select({ roastDate: rotationPicks.roastDate, lotCode: lots.code, lotName: lots.name, note: rotationPicks.note })
        .from(rotationPicks)
        .innerJoin(lots, eq(lots.id, rotationPicks.lotId))
        .where(between(rotationPicks.roastDate, from, to));
    },

    /** Roaster's Rotation subscriptions that roast now or after a pause, with what they bring. */
    async rotationSubscriptions() {
      return db
        .select({
          id: subscriptions.id,
          status: subscriptions.status,
          anchorDate: subscriptions.anchorDate,
          cadenceWeeks: subscriptions.cadenceWeeks,
          pausedUntil: subscriptions.pausedUntil,
          cancelAtPeriodEnd: subscriptions.cancelAtPeriodEnd,
          roastLevel: subscriptions.roastLevel,
          bagSize: subscriptions.bagSize,
          bagsPerDelivery: subscriptions.bagsPerDelivery,
          grind: subscriptions.grind,
          brewMethod: subscriptions.brewMethod,
        })
        .from(subscriptions)
        .where(and(isNull(subscriptions.lotId), inArray(subscriptions.status, ['active', 'paused'])));
    },

    /** The kept delivery rows of those subscriptions, with the bags and roasted grams each one's order holds once paid. */
    async keptDeliveries(subscriptionIds: string[]) {
      if (subscriptionIds.length === 0) return [];
      return db
        .select({
          ...keptDeliveryColumns,
          orderBags: sql<number | null>`sum(${orderItems.quantity})::int`,
          orderGrams: sql<number | null>`sum(${orderItems.quantity} * ${orderItems.fillGrams})::int`,
        })
        .from(deliveries)
        .leftJoin(orderItems, eq(orderItems.orderId, deliveries.orderId))
        .where(inArray(deliveries.subscriptionId, subscriptionIds))
        .groupBy(deliveries.id)
        .orderBy(asc(deliveries.roastDate));
    },

    async findLot(code: string) {
      const [lot] = await db
        .select({ id: lots.id, code: lots.code, name: lots.name, isListed: lots.isListed, stockGrams: lots.stockGrams })
        .from(lots)
        .where(eq(lots.code, code));
      return lot;
    },

    /** Whether any Roaster's Rotation bag of that roast day has been roasted already. */
    async rotationRoasted(roastDate: string): Promise<boolean> {
      const [row] = await db
        .select({ id: orders.id })
        .from(orders)
        .innerJoin(orderItems, eq(orderItems.orderId, orders.id))
        .where(
          and(eq(orders.roastDate, roastDate), inArray(orders.status, [...roastedOrderStatuses]), eq(orderItems.kind, 'roasted'), isNull(orderItems.lotId)),
        )
        .limit(1);
      return row !== undefined;
    },

    /** Saves the day's pick (replacing an earlier one) and returns the lot code it replaced, if any. */
    async savePick(pick: { roastDate: string; lotId: string; note: string; pickedBy: string }): Promise<{ previousLotCode: string | null }> {
      return db.transaction(async (tx) => {
        const [previous] = await tx
          .select({ lotCode: lots.code })
          .from(rotationPicks)
          .innerJoin(lots, eq(lots.id, rotationPicks.lotId))
          .where(eq(rotationPicks.roastDate, pick.roastDate))
          .for('update', { of: rotationPicks });
        await tx
          .insert(rotationPicks)
          .values(pick)
          .onConflictDoUpdate({ target: rotationPicks.roastDate, set: { lotId: pick.lotId, note: pick.note, pickedBy: pick.pickedBy } });
        return { previousLotCode: previous?.lotCode ?? null };
      });
    },
  };
}

export type RotationRepo = ReturnType<typeof createRotationRepo>;
