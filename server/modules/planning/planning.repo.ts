import { and, asc, between, eq, gte, inArray, isNull, or, sql } from 'drizzle-orm';
import { addDays, type IsoDate } from '@shared/domain/shop-time';
import { SEARCH_HORIZON_DAYS } from '@shared/domain/roast-schedule';
import type { Db } from '../../db/client';
import { deliveries, lots, rotationPicks, stockMovements, subscriptions } from '../../db/schema/index';
import { measuredLossByLot, roastedDemandBetween } from '../roastery';
import { loadCalendarOverrides, loadShopSettings } from '../settings';
import { keptDeliveryColumns } from '../subscriptions';

/** What green planning reads: stock, demand still to roast, subscriptions and their kept deliveries, and the pace of green sales. */
export function createPlanningRepo(db: Db) {
  return {
    shopSettings: async () => (await loadShopSettings(db)).settings,

    /** Overrides from a delivery's earliest nominal date on: closures move deliveries up to the search horizon. */
    calendarOverrides: (today: IsoDate) => loadCalendarOverrides(db, addDays(today, -SEARCH_HORIZON_DAYS)),

    /** Every lot, with its green sold (sale movements) since `soldSince`. */
    async lots(soldSince: Date) {
      const result = await db.execute<{
        code: string;
        name: string;
        stock_grams: number;
        reorder_point_grams: number;
        supplier_lead_time_days: number;
        is_listed: boolean;
        sold_grams: string;
      }>(sql`
        select l.code, l.name, l.stock_grams, l.reorder_point_grams, l.supplier_lead_time_days, l.is_listed,
               coalesce((select -sum(m.delta_grams) from ${stockMovements} m
                         where m.lot_id = l.id and m.reason = 'sale' and m.created_at >= ${soldSince.toISOString()}::timestamptz), 0)::int8 as sold_grams
        from ${lots} l
        order by l.code
      `);
      return result.rows.map((row) => ({
        code: row.code,
        name: row.name,
        stockGrams: Number(row.stock_grams),
        reorderPointGrams: Number(row.reorder_point_grams),
        leadTimeDays: Number(row.supplier_lead_time_days),
        isListed: row.is_listed,
        greenSoldGrams: Math.max(0, Number(row.sold_grams)),
      }));
    },

    /** Bags of paid and held roasted orders still to roast between two days, by day, lot (a rotation line takes the day's pick), level and fill. */
    paidDemand: (from: IsoDate, to: IsoDate) => roastedDemandBetween(db, from, to),

    /** Subscriptions that will deliver again, with their lot's code (null: Roaster's Rotation). */
    async subscriptions() {
      return db
        .select({
          id: subscriptions.id,
          lotCode: lots.code,
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
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(inArray(subscriptions.status, ['active', 'paused', 'past_due']));
    },

    /**
     * Kept delivery rows a plan from today still reads: those roasting from today on, and those
     * due on the grid from `nominalFrom` (the grid deliveries they stand in for). Rows with no grid
     * date are read back to the search horizon, as a grid delivery's nominal date lies at most that
     * far before its roast.
     */
    async keptDeliveries(subscriptionIds: readonly string[], today: IsoDate, nominalFrom: IsoDate) {
      if (subscriptionIds.length === 0) return [];
      return db
        .select(keptDeliveryColumns)
        .from(deliveries)
        .where(
          and(
            inArray(deliveries.subscriptionId, [...subscriptionIds]),
            or(
              gte(deliveries.roastDate, today),
              gte(deliveries.nominalDate, nominalFrom),
              and(isNull(deliveries.nominalDate), gte(deliveries.roastDate, addDays(today, -SEARCH_HORIZON_DAYS))),
            ),
          ),
        )
        .orderBy(asc(deliveries.roastDate));
    },

    async rotationPicks(from: IsoDate, to: IsoDate): Promise<Record<IsoDate, string>> {
      const rows = await db
        .select({ roastDate: rotationPicks.roastDate, lotCode: lots.code })
        .from(rotationPicks)
        .innerJoin(lots, eq(lots.id, rotationPicks.lotId))
        .where(between(rotationPicks.roastDate, from, to));
      return Object.fromEntries(rows.map((row) => [row.roastDate, row.lotCode]));
    },

    /** What each lot's recorded batches add up to per level (the loss model's measured loss). */
    lossHistory: () => measuredLossByLot(db),
  };
}

export type PlanningRepo = ReturnType<typeof createPlanningRepo>;
