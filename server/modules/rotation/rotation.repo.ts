import { and, between, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { RoastedBagSize, RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { deliveries, lots, orderItems, orders, roastDays, rotationPicks, subscriptions } from '../../db/schema/index';
import { loadShopSettings } from '../settings/settings.repo';

/** Deliveries that roast on their day: not skipped, and not held for an unpaid renewal. */
const roastingDeliveryStatuses = ['scheduled', 'roasted', 'shipped'] as const;
/** Orders whose coffee has been roasted already. */
const roastedOrderStatuses = ['roasted', 'packed', 'shipped'] as const;

export function createRotationRepo(db: Db) {
  return {
    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    async calendarOverrides(from: string, to: string) {
      return db
        .select({ date: roastDays.date, open: roastDays.open, capacityGrams: roastDays.capacityGrams, note: roastDays.note })
        .from(roastDays)
        .where(between(roastDays.date, from, to));
    },

    async picks(from: string, to: string) {
      return db
        .select({ roastDate: rotationPicks.roastDate, lotCode: lots.code, lotName: lots.name, note: rotationPicks.note })
        .from(rotationPicks)
        .innerJoin(lots, eq(lots.id, rotationPicks.lotId))
        .where(between(rotationPicks.roastDate, from, to));
    },

    /**
     * Each delivery of an active Roaster's Rotation subscription roasting between the days: what it
     * brings (frozen on the delivery once its cutoff passed, else the subscription's current choice),
     * and the bags its order holds once paid.
     */
    async rotationDeliveries(from: string, to: string) {
      return db
        .select({
          roastDate: deliveries.roastDate,
          subscriptionId: deliveries.subscriptionId,
          roastLevel: sql<RoastLevel>`coalesce(${deliveries.roastLevel}, ${subscriptions.roastLevel})`,
          bagSize: sql<RoastedBagSize>`coalesce(${deliveries.bagSize}, ${subscriptions.bagSize})`,
          bagsPerDelivery: sql<number>`coalesce(${deliveries.bagsPerDelivery}, ${subscriptions.bagsPerDelivery})`,
          orderBags: sql<number | null>`sum(${orderItems.quantity})::int`,
          orderGrams: sql<number | null>`sum(${orderItems.quantity} * ${orderItems.fillGrams})::int`,
        })
        .from(deliveries)
        .innerJoin(subscriptions, eq(subscriptions.id, deliveries.subscriptionId))
        .leftJoin(orderItems, eq(orderItems.orderId, deliveries.orderId))
        .where(
          and(
            between(deliveries.roastDate, from, to),
            inArray(deliveries.status, [...roastingDeliveryStatuses]),
            isNull(subscriptions.lotId),
            eq(subscriptions.status, 'active'),
          ),
        )
        .groupBy(deliveries.id, subscriptions.id);
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
        .where(and(eq(orders.roastDate, roastDate), inArray(orders.status, [...roastedOrderStatuses]), eq(orderItems.kind, 'roasted'), isNull(orderItems.lotId)))
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
