import { sql } from 'drizzle-orm';
import type { IsoDate } from '@shared/domain/shop-time';
import type { OrderKind, RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { loadShopSettings } from '../settings';

/** A span of the Ledger: its first and last shop-local days and the instants that bound them. */
export interface LedgerSpan {
  timeZone: string;
  from: IsoDate;
  /** The day after the last one. */
  end: IsoDate;
  fromInstant: Date;
  endInstant: Date;
}

const week = (column: ReturnType<typeof sql>) => sql`date_trunc('week', ${column})::date::text`;

/**
 * The Ledger's weekly sums. Each reads one table through an index on the time it buckets by
 * (paid_at, refunded_at, roast_date); weeks are ISO weeks of the shop-local day.
 */
export function createLedgerRepo(db: Db) {
  return {
    shopSettings: async () => (await loadShopSettings(db)).settings,

    async paidByWeek({ timeZone, fromInstant, endInstant }: LedgerSpan) {
      const local = sql`(o.paid_at at time zone ${timeZone})`;
      const result = await db.execute<{ week_start: string; kind: OrderKind; subscription: boolean; cents: string; orders: string }>(sql`
        select ${week(local)} as week_start, o.kind, o.subscription_id is not null as subscription,
               sum(o.total_cents)::int8 as cents, count(*)::int8 as orders
        from orders o
        where o.paid_at >= ${fromInstant.toISOString()}::timestamptz and o.paid_at < ${endInstant.toISOString()}::timestamptz
        group by 1, 2, 3
      `);
      return result.rows.map((row) => ({
        weekStart: row.week_start,
        kind: row.kind,
        subscription: row.subscription,
        cents: Number(row.cents),
        orders: Number(row.orders),
      }));
    },

    async refundsByWeek({ timeZone, fromInstant, endInstant }: LedgerSpan) {
      const local = sql`(o.refunded_at at time zone ${timeZone})`;
      const result = await db.execute<{ week_start: string; cents: string }>(sql`
        select ${week(local)} as week_start, sum(o.refunded_cents)::int8 as cents
        from orders o
        where o.refunded_at >= ${fromInstant.toISOString()}::timestamptz and o.refunded_at < ${endInstant.toISOString()}::timestamptz
        group by 1
      `);
      return new Map(result.rows.map((row) => [row.week_start, Number(row.cents)]));
    },

    /** Green grams of paid green orders, by the week they were paid. */
    async greenSoldByWeek({ timeZone, fromInstant, endInstant }: LedgerSpan) {
      const local = sql`(o.paid_at at time zone ${timeZone})`;
      const result = await db.execute<{ week_start: string; grams: string }>(sql`
        select ${week(local)} as week_start, sum(oi.quantity * oi.fill_grams)::int8 as grams
        from orders o
        join order_items oi on oi.order_id = o.id
        where o.kind = 'green' and o.paid_at >= ${fromInstant.toISOString()}::timestamptz and o.paid_at < ${endInstant.toISOString()}::timestamptz
        group by 1
      `);
      return new Map(result.rows.map((row) => [row.week_start, Number(row.grams)]));
    },

    async roastedByWeek({ from, end }: LedgerSpan) {
      const result = await db.execute<{ week_start: string; grams: string }>(sql`
        select ${week(sql`b.roast_date`)} as week_start, sum(b.green_grams_in)::int8 as grams
        from batches b
        where b.roast_date >= ${from} and b.roast_date < ${end}
        group by 1
      `);
      return new Map(result.rows.map((row) => [row.week_start, Number(row.grams)]));
    },

    /** Recorded batches in the span by lot and level. */
    async lossByLot({ from, end }: LedgerSpan) {
      const result = await db.execute<{ code: string; name: string; roast_level: RoastLevel; batches: string; green: string; roasted: string }>(sql`
        select l.code, l.name, b.roast_level, count(*)::int8 as batches, sum(b.green_grams_in)::int8 as green, sum(b.roasted_grams_out)::int8 as roasted
        from batches b
        join lots l on l.id = b.lot_id
        where b.roast_date >= ${from} and b.roast_date < ${end}
        group by 1, 2, 3
        order by 1, 3
      `);
      return result.rows.map((row) => ({
        lotCode: row.code,
        name: row.name,
        roastLevel: row.roast_level,
        batches: Number(row.batches),
        greenGramsIn: Number(row.green),
        roastedGramsOut: Number(row.roasted),
      }));
    },

    /** Subscriptions that were on the books at some time in the span. */
    async subscriptionsInSpan({ fromInstant, endInstant }: LedgerSpan) {
      const result = await db.execute<{
        created_at: Date;
        cancelled_at: Date | null;
        paused_at: Date | null;
        paused_until: string | null;
        price_cents: number;
        cadence_weeks: number;
      }>(sql`
        select s.created_at, s.cancelled_at, s.paused_at, s.paused_until::text as paused_until, s.price_cents, s.cadence_weeks
        from subscriptions s
        where s.status <> 'incomplete' and s.created_at < ${endInstant.toISOString()}::timestamptz
          and (s.cancelled_at is null or s.cancelled_at >= ${fromInstant.toISOString()}::timestamptz)
      `);
      const instantOf = (value: Date | string | null) => (value === null ? null : new Date(value));
      return result.rows.map((row) => ({
        createdAt: instantOf(row.created_at)!,
        cancelledAt: instantOf(row.cancelled_at),
        pausedAt: instantOf(row.paused_at),
        pausedUntil: row.paused_until,
        priceCents: Number(row.price_cents),
        cadenceWeeks: Number(row.cadence_weeks),
      }));
    },
  };
}

export type LedgerRepo = ReturnType<typeof createLedgerRepo>;
