import { eq, sql } from 'drizzle-orm';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { roastDays } from '../../db/schema/index';
import { loadShopSettings } from '../settings';

/**
 * One group of a roast day's bags: a lot (or an unpicked Roaster's Rotation, lotCode null), a level
 * and a fill weight, with the lot's stock and what its recorded batches at that level add up to.
 */
export interface RoastDayGroup {
  lotCode: string | null;
  lotName: string | null;
  stockGrams: number;
  roastLevel: RoastLevel;
  fillGrams: number;
  bags: number;
  /** Of those, bags already roasted, packed or shipped. */
  doneBags: number;
  /** Every batch of this lot at this level, on any day: what the loss model learns from. */
  historyBatches: number;
  historyGreenGrams: number;
  historyRoastedGrams: number;
  /** The batches of those recorded for this roast day. */
  dayBatches: number;
  dayGreenGrams: number;
  dayRoastedGrams: number;
  /** Roasted grams of this day's batches that bags have already taken (at packing). */
  dayAllocatedGrams: number;
}

/**
 * The orders of a roast day's record: roasted-coffee orders with that roast date that are paid or
 * held (still to roast) or already roasted, packed or shipped. A Roaster's Rotation line (no lot)
 * takes the lot picked for the day, when there is one.
 */
const roastDayOrdersWhere = (roastDate: string) => sql`
  o.roast_date = ${roastDate} and o.kind = 'roasted' and o.status in ('paid', 'held', 'roasted', 'packed', 'shipped') and oi.kind = 'roasted'`;

export function createRoastListRepo(db: Db) {
  return {
    /**
     * The day's order lines summed in SQL by lot, level and fill weight (a day of thousands of
     * lines comes back as a few hundred rows at most), with stock and batch history in the same query.
     */
    async dayGroups(roastDate: string): Promise<RoastDayGroup[]> {
      const result = await db.execute<Record<string, string | number | null>>(sql`
        with summed as (
          select oi.lot_id, oi.roast_level, oi.fill_grams, sum(oi.quantity)::int8 as bags,
            coalesce(sum(oi.quantity) filter (where o.status in ('roasted', 'packed', 'shipped')), 0)::int8 as done_bags
          from orders o
          join order_items oi on oi.order_id = o.id
          where ${roastDayOrdersWhere(roastDate)}
          group by 1, 2, 3
        ),
        -- The day's rotation pick joins the few summed groups, not every line.
        day_lines as (
          select coalesce(s.lot_id, rp.lot_id) as lot_id, s.roast_level, s.fill_grams, s.bags, s.done_bags
          from summed s
          left join rotation_picks rp on s.lot_id is null and rp.roast_date = ${roastDate}
        ),
        history as (
          select b.lot_id, b.roast_level,
            count(*)::int8 as batches,
            sum(b.green_grams_in)::int8 as green,
            sum(b.roasted_grams_out)::int8 as roasted,
            count(*) filter (where b.roast_date = ${roastDate})::int8 as day_batches,
            coalesce(sum(b.green_grams_in) filter (where b.roast_date = ${roastDate}), 0)::int8 as day_green,
            coalesce(sum(b.roasted_grams_out) filter (where b.roast_date = ${roastDate}), 0)::int8 as day_roasted
          from batches b
          where b.lot_id in (select lot_id from day_lines where lot_id is not null)
          group by 1, 2
        ),
        allocated as (
          select b.lot_id, b.roast_level, sum(ba.grams)::int8 as grams
          from batches b
          join bag_allocations ba on ba.batch_id = b.id
          where b.roast_date = ${roastDate} and b.lot_id in (select lot_id from day_lines where lot_id is not null)
          group by 1, 2
        )
        select l.code, l.name, l.stock_grams, d.roast_level, d.fill_grams, d.bags, d.done_bags, coalesce(a.grams, 0) as day_allocated,
          coalesce(h.batches, 0) as batches, coalesce(h.green, 0) as green, coalesce(h.roasted, 0) as roasted,
          coalesce(h.day_batches, 0) as day_batches, coalesce(h.day_green, 0) as day_green, coalesce(h.day_roasted, 0) as day_roasted
        from day_lines d
        left join lots l on l.id = d.lot_id
        left join history h on h.lot_id = d.lot_id and h.roast_level = d.roast_level
        left join allocated a on a.lot_id = d.lot_id and a.roast_level = d.roast_level
      `);
      return result.rows.map((row) => ({
        lotCode: row.code as string | null,
        lotName: row.name as string | null,
        stockGrams: Number(row.stock_grams ?? 0),
        roastLevel: row.roast_level as RoastLevel,
        fillGrams: Number(row.fill_grams),
        bags: Number(row.bags),
        doneBags: Number(row.done_bags),
        historyBatches: Number(row.batches),
        historyGreenGrams: Number(row.green),
        historyRoastedGrams: Number(row.roasted),
        dayBatches: Number(row.day_batches),
        dayGreenGrams: Number(row.day_green),
        dayRoastedGrams: Number(row.day_roasted),
        dayAllocatedGrams: Number(row.day_allocated),
      }));
    },

    shopSettings: () => loadShopSettings(db),

    /** Staff's override for the day on the Roast Calendar, if any. */
    async dayOverride(roastDate: string) {
      const [row] = await db
        .select({ open: roastDays.open, capacityGrams: roastDays.capacityGrams, note: roastDays.note })
        .from(roastDays)
        .where(eq(roastDays.date, roastDate));
      return row;
    },
  };
}

export type RoastListRepo = ReturnType<typeof createRoastListRepo>;
