import { and, eq, gte, inArray, sql } from 'drizzle-orm';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { lots, orderItems, orders } from '../../db/schema/index';
import { loadCalendarOverrides, loadShopSettings } from '../settings';

/** Orders whose bags claim their roast day's capacity: paid, and not cancelled or refunded. */
const plannedStatuses = ['paid', 'held', 'roasted', 'packed', 'shipped'] as const;

export function createSubscriptionPreviewRepo(db: Db) {
  return {
    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    /** A lot on sale in Green Lots, by code; an unlisted lot reads as absent. */
    async findListedLot(code: string) {
      const [lot] = await db
        .select({ name: lots.name, allowedLevels: lots.allowedLevels })
        .from(lots)
        .where(and(eq(lots.code, code), eq(lots.isListed, true)));
      return lot;
    },

    /** Roast Calendar overrides from `from` on. */
    calendarOverrides: (from: string) => loadCalendarOverrides(db, from),

    /** Roasted grams already ordered per roast day (from `from` on) and level. */
    async plannedRoastedGrams(from: string): Promise<{ roastDate: string; roastLevel: RoastLevel; roastedGrams: number }[]> {
      const rows = await db
        .select({
          roastDate: orders.roastDate,
          roastLevel: orderItems.roastLevel,
          roastedGrams: sql<number>`sum(${orderItems.quantity} * ${orderItems.fillGrams})::int`,
        })
        .from(orderItems)
        .innerJoin(orders, eq(orders.id, orderItems.orderId))
        .where(and(gte(orders.roastDate, from), eq(orderItems.kind, 'roasted'), inArray(orders.status, [...plannedStatuses])))
        .groupBy(orders.roastDate, orderItems.roastLevel);
      return rows.flatMap((row) =>
        row.roastDate && row.roastLevel ? [{ roastDate: row.roastDate, roastLevel: row.roastLevel, roastedGrams: row.roastedGrams }] : [],
      );
    },
  };
}

export type SubscriptionPreviewRepo = ReturnType<typeof createSubscriptionPreviewRepo>;
