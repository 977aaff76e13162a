import { sql } from 'drizzle-orm';
import type { IsoDate } from '@shared/domain/shop-time';
import type { Db } from '../../db/client';
import { loadCalendarOverrides, loadShopSettings } from '../settings';

/** Counts of what is due or stuck, for the Roastery's Today overview. */
export function createTodayRepo(db: Db) {
  return {
    shopSettings: async () => (await loadShopSettings(db)).settings,
    calendarOverrides: (from: IsoDate) => loadCalendarOverrides(db, from),

    /**
     * Parcels due out by `today`: roasted orders roasted but not packed and paid green orders (to
     * pack), and packed orders not yet shipped (to ship).
     */
    async parcelsDue(today: IsoDate) {
      const result = await db.execute<{ to_pack: string; to_ship: string }>(sql`
        select count(*) filter (where (o.kind = 'roasted' and o.status = 'roasted') or (o.kind = 'green' and o.status = 'paid'))::int8 as to_pack,
               count(*) filter (where o.status = 'packed')::int8 as to_ship
        from orders o
        where o.ship_date <= ${today} and o.status in ('paid', 'roasted', 'packed')
      `);
      const row = result.rows[0];
      return { toPack: Number(row?.to_pack ?? 0), toShip: Number(row?.to_ship ?? 0) };
    },

    /** Orders on hold (an unpaid renewal) and orders awaiting payment since before `awaitingSince`. */
    async stuckOrders(awaitingSince: Date) {
      const result = await db.execute<{ held: string; awaiting: string }>(sql`
        select count(*) filter (where o.status = 'held')::int8 as held,
               count(*) filter (where o.status = 'pending_payment' and o.created_at < ${awaitingSince.toISOString()}::timestamptz)::int8 as awaiting
        from orders o
        where o.status in ('held', 'pending_payment')
      `);
      const row = result.rows[0];
      return { held: Number(row?.held ?? 0), awaitingPayment: Number(row?.awaiting ?? 0) };
    },

    /** Messages the outbox gave up on, newest first, with the order they concern when there is one. */
    async failedMessages(limit: number) {
      const result = await db.execute<{
        id: string;
        template: string;
        to_address: string;
        attempts: number;
        created_at: Date;
        order_id: string | null;
        total: string;
      }>(sql`
        select e.id, e.template, e.to_address, e.attempts, e.created_at, e.payload->>'orderId' as order_id, count(*) over ()::int8 as total
        from email_outbox e
        where e.status = 'failed'
        order by e.created_at desc
        limit ${limit}
      `);
      return {
        count: Number(result.rows[0]?.total ?? 0),
        items: result.rows.map((row) => ({
          id: row.id,
          template: row.template,
          to: row.to_address,
          attempts: Number(row.attempts),
          createdAt: new Date(row.created_at).toISOString(),
          orderId: row.order_id,
        })),
      };
    },
  };
}

export type TodayRepo = ReturnType<typeof createTodayRepo>;
