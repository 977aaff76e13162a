import { and, asc, between, eq, gte, inArray, isNull, lte, or, sql } from 'drizzle-orm';
import type { CalendarOverride } from '@shared/domain/roast-schedule';
import { addDays, type IsoDate } from '@shared/domain/shop-time';
import { SEARCH_HORIZON_DAYS } from '@shared/domain/roast-schedule';
import { roastersRotationName, type BrewMethod, type RoastLevel } from '@shared/domain/vocabulary';
import type { CalendarDayUpdate } from '@shared/schemas/roastery';
import type { ShopSettings } from '@shared/schemas/settings';
import type { Db, DbOrTx } from '../../db/client';
import { batches, deliveries, lots, orderItems, orders, roastDays, subscriptions, users } from '../../db/schema/index';
import { queueEmail } from '../outbox';
import { loadShopSettings } from '../settings';
import type { ClosurePlan, DeliveryOnClosedDay, LossHistoryRow, OrderOnClosedDay, ParcelToRedate, PlannedGroup, ShipMove } from './calendar-planning';

export interface RoastedOnDay {
  batches: number;
  greenGrams: number;
  roastedGrams: number;
}

export interface OverrideRow {
  date: IsoDate;
  open: boolean;
  shipOpen: boolean | null;
  capacityGrams: number | null;
  note: string;
}

export const overrideOf = (row: OverrideRow): CalendarOverride => ({
  open: row.open,
  shipOpen: row.shipOpen,
  capacityGrams: row.capacityGrams,
  note: row.note || null,
});

async function overridesBetween(db: DbOrTx, from: IsoDate, to: IsoDate): Promise<OverrideRow[]> {
  return db
    .select({ date: roastDays.date, open: roastDays.open, shipOpen: roastDays.shipOpen, capacityGrams: roastDays.capacityGrams, note: roastDays.note })
    .from(roastDays)
    .where(between(roastDays.date, from, to))
    .orderBy(asc(roastDays.date));
}

/** Bags of the paid and held roasted-coffee orders roasting between two days, summed by day, lot, level and fill. */
export async function plannedGroups(db: DbOrTx, from: IsoDate, to: IsoDate): Promise<PlannedGroup[]> {
  const result = await db.execute<{ roast_date: string; code: string | null; roast_level: RoastLevel; fill_grams: number; bags: string }>(sql`
    select o.roast_date, l.code, oi.roast_level, oi.fill_grams, sum(oi.quantity)::int8 as bags
    from orders o
    join order_items oi on oi.order_id = o.id
    left join rotation_picks rp on oi.lot_id is null and rp.roast_date = o.roast_date
    left join lots l on l.id = coalesce(oi.lot_id, rp.lot_id)
    where o.roast_date between ${from} and ${to} and o.kind = 'roasted' and o.status in ('paid', 'held') and oi.kind = 'roasted'
    group by 1, 2, 3, 4
  `);
  return result.rows.map((row) => ({
    roastDate: row.roast_date,
    lotCode: row.code,
    roastLevel: row.roast_level,
    fillGrams: Number(row.fill_grams),
    bags: Number(row.bags),
  }));
}

export async function lossHistory(db: DbOrTx): Promise<LossHistoryRow[]> {
  return db
    .select({
      lotCode: lots.code,
      roastLevel: batches.roastLevel,
      batchCount: sql<number>`count(*)`.mapWith(Number),
      greenGramsIn: sql<number>`sum(${batches.greenGramsIn})`.mapWith(Number),
      roastedGramsOut: sql<number>`sum(${batches.roastedGramsOut})`.mapWith(Number),
    })
    .from(batches)
    .innerJoin(lots, eq(lots.id, batches.lotId))
    .groupBy(lots.code, batches.roastLevel);
}

export interface CalendarContext {
  settings: ShopSettings;
  overrides: OverrideRow[];
  groups: PlannedGroup[];
  lossHistory: LossHistoryRow[];
}

/** What a closure has to move, and the calendar from the closed day on. */
export interface MovingCoffee {
  closedDate: IsoDate;
  orders: OrderOnClosedDay[];
  deliveries: DeliveryOnClosedDay[];
  context: CalendarContext;
}

export interface DayUpdateResult {
  override: OverrideRow;
  context: CalendarContext;
  plan: ClosurePlan;
  shipMoves: ShipMove[];
}

/** What a change of the day's shipping has to re-date, and the overrides from the day on. */
export interface RedatingParcels {
  date: IsoDate;
  parcels: ParcelToRedate[];
  context: CalendarContext;
}

/** The Roast Calendar's reads, and changing a day (with the moves a closure makes) in one transaction. */
export function createCalendarRepo(db: Db) {
  /** Reads in parallel on the pool; one after another inside a transaction (a connection runs one query at a time). */
  async function context(handle: DbOrTx, from: IsoDate, to: IsoDate, inTransaction = false): Promise<CalendarContext> {
    if (!inTransaction) {
      const [{ settings }, overrides, groups, history] = await Promise.all([
        loadShopSettings(handle),
        overridesBetween(handle, from, to),
        plannedGroups(handle, from, to),
        lossHistory(handle),
      ]);
      return { settings, overrides, groups, lossHistory: history };
    }
    const { settings } = await loadShopSettings(handle);
    const overrides = await overridesBetween(handle, from, to);
    const groups = await plannedGroups(handle, from, to);
    return { settings, overrides, groups, lossHistory: await lossHistory(handle) };
  }

  /** The paid or held roasted orders on the day, with their lines and customer, locked for the move. */
  async function ordersOn(tx: DbOrTx, date: IsoDate): Promise<OrderOnClosedDay[]> {
    const rows = await tx
      .select({
        id: orders.id,
        paidAt: orders.paidAt,
        deliveryId: orders.deliveryId,
        email: users.email,
        name: users.name,
        lotName: lots.name,
        roastLevel: orderItems.roastLevel,
        brewMethod: orderItems.brewMethod,
        fillGrams: orderItems.fillGrams,
        quantity: orderItems.quantity,
      })
      .from(orders)
      .innerJoin(users, eq(users.id, orders.userId))
      .innerJoin(orderItems, and(eq(orderItems.orderId, orders.id), eq(orderItems.kind, 'roasted')))
      .leftJoin(lots, eq(lots.id, orderItems.lotId))
      .where(and(eq(orders.roastDate, date), eq(orders.kind, 'roasted'), inArray(orders.status, ['paid', 'held'])))
      .orderBy(asc(orders.id))
      .for('update', { of: orders });
    const byId = new Map<string, OrderOnClosedDay>();
    for (const row of rows) {
      let order = byId.get(row.id);
      if (!order) {
        order = { id: row.id, paidAt: row.paidAt, deliveryId: row.deliveryId, customer: { email: row.email, name: row.name }, lines: [] };
        byId.set(row.id, order);
      }
      order.lines.push({
        coffee: row.lotName ?? roastersRotationName,
        // The roasted-line CHECK guarantees level and brew method.
        roastLevel: row.roastLevel as RoastLevel,
        brewMethod: row.brewMethod as BrewMethod,
        fillGrams: row.fillGrams,
        quantity: row.quantity,
      });
    }
    return [...byId.values()];
  }

  /** Subscription deliveries still to roast on the day that no moving order carries. */
  async function deliveriesOn(tx: DbOrTx, date: IsoDate, carried: ReadonlySet<string>): Promise<DeliveryOnClosedDay[]> {
    const rows = await tx
      .select({
        id: deliveries.id,
        subscriptionId: deliveries.subscriptionId,
        email: users.email,
        name: users.name,
        lotName: lots.name,
        roastLevel: subscriptions.roastLevel,
        brewMethod: subscriptions.brewMethod,
      })
      .from(deliveries)
      .innerJoin(subscriptions, eq(subscriptions.id, deliveries.subscriptionId))
      .innerJoin(users, eq(users.id, subscriptions.userId))
      .leftJoin(lots, eq(lots.id, subscriptions.lotId))
      .where(and(eq(deliveries.roastDate, date), inArray(deliveries.status, ['scheduled', 'held'])))
      .orderBy(asc(deliveries.id))
      .for('update', { of: deliveries });
    return rows
      .filter((row) => !carried.has(row.id))
      .map((row) => ({
        id: row.id,
        subscriptionId: row.subscriptionId,
        customer: { email: row.email, name: row.name },
        coffee: row.lotName ?? roastersRotationName,
        roastLevel: row.roastLevel,
        brewMethod: row.brewMethod,
      }));
  }

  /**
   * Parcels not yet packed that could ship on `date` (roasted on or before it, shipping on or after
   * it): roasted orders, subscription deliveries not yet paid, and green orders. Locked for the move.
   */
  async function parcelsAround(tx: DbOrTx, date: IsoDate): Promise<ParcelToRedate[]> {
    const orderRows = await tx
      .select({
        id: orders.id,
        kind: orders.kind,
        paidAt: orders.paidAt,
        deliveryId: orders.deliveryId,
        roastDate: orders.roastDate,
        shipDate: orders.shipDate,
        roastLevel: orderItems.roastLevel,
        brewMethod: orderItems.brewMethod,
      })
      .from(orders)
      .leftJoin(orderItems, and(eq(orderItems.orderId, orders.id), eq(orderItems.kind, 'roasted')))
      .where(
        and(
          gte(orders.shipDate, date),
          or(
            and(eq(orders.kind, 'roasted'), lte(orders.roastDate, date), inArray(orders.status, ['paid', 'held', 'roasted'])),
            and(eq(orders.kind, 'green'), eq(orders.status, 'paid')),
          ),
        ),
      )
      .orderBy(asc(orders.id))
      .for('update', { of: orders });
    const parcels = new Map<string, ParcelToRedate>();
    for (const row of orderRows) {
      const shipDate = row.shipDate as IsoDate;
      if (row.kind === 'green') {
        if (row.paidAt) parcels.set(row.id, { kind: 'green', orderId: row.id, paidAt: row.paidAt, shipDate });
        continue;
      }
      let parcel = parcels.get(row.id);
      if (!parcel) {
        parcel = { kind: 'roasted', orderId: row.id, deliveryId: row.deliveryId, roastDate: row.roastDate as IsoDate, shipDate, lines: [] };
        parcels.set(row.id, parcel);
      }
      // The roasted-line CHECK guarantees level and brew method.
      if (parcel.kind === 'roasted' && row.roastLevel && row.brewMethod) parcel.lines.push({ roastLevel: row.roastLevel, brewMethod: row.brewMethod });
    }
    const deliveryRows = await tx
      .select({
        id: deliveries.id,
        roastDate: deliveries.roastDate,
        shipDate: deliveries.shipDate,
        roastLevel: sql<RoastLevel>`coalesce(${deliveries.roastLevel}, ${subscriptions.roastLevel})`,
        brewMethod: sql<BrewMethod>`coalesce(${deliveries.brewMethod}, ${subscriptions.brewMethod})`,
      })
      .from(deliveries)
      .innerJoin(subscriptions, eq(subscriptions.id, deliveries.subscriptionId))
      .where(
        and(lte(deliveries.roastDate, date), gte(deliveries.shipDate, date), isNull(deliveries.orderId), inArray(deliveries.status, ['scheduled', 'held'])),
      )
      .orderBy(asc(deliveries.id))
      .for('update', { of: deliveries });
    const deliveryParcels: ParcelToRedate[] = deliveryRows.map((row) => ({
      kind: 'roasted',
      orderId: null,
      deliveryId: row.id,
      roastDate: row.roastDate as IsoDate,
      shipDate: row.shipDate as IsoDate,
      lines: [{ roastLevel: row.roastLevel, brewMethod: row.brewMethod }],
    }));
    return [...parcels.values(), ...deliveryParcels];
  }

  return {
    context: (from: IsoDate, to: IsoDate) => context(db, from, to),

    /** Paid or held roasted-coffee orders per roast day between two days. */
    async orderCounts(from: IsoDate, to: IsoDate): Promise<Map<IsoDate, number>> {
      const rows = await db
        .select({ roastDate: orders.roastDate, count: sql<number>`count(*)`.mapWith(Number) })
        .from(orders)
        .where(and(between(orders.roastDate, from, to), eq(orders.kind, 'roasted'), inArray(orders.status, ['paid', 'held'])))
        .groupBy(orders.roastDate);
      return new Map(rows.map((row) => [row.roastDate as IsoDate, row.count]));
    },

    /** What the recorded batches of each day between two days add up to. */
    async roastedByDay(from: IsoDate, to: IsoDate): Promise<Map<IsoDate, RoastedOnDay>> {
      const rows = await db
        .select({
          roastDate: batches.roastDate,
          batches: sql<number>`count(*)`.mapWith(Number),
          greenGrams: sql<number>`sum(${batches.greenGramsIn})`.mapWith(Number),
          roastedGrams: sql<number>`sum(${batches.roastedGramsOut})`.mapWith(Number),
        })
        .from(batches)
        .where(between(batches.roastDate, from, to))
        .groupBy(batches.roastDate);
      return new Map(rows.map(({ roastDate, ...roasted }) => [roastDate as IsoDate, roasted]));
    },

    /**
     * Sets the day's override and, when the day ends up closed, moves its coffee as `plan` decides
     * and queues the e-mails, all in one transaction. Calendar changes take one lock in turn, so two
     * closures never fill the same later day past its capacity.
     */
    async updateDay(
      date: IsoDate,
      update: CalendarDayUpdate,
      isWeeklyDefault: (override: OverrideRow, settings: ShopSettings) => boolean,
      plan: (moving: MovingCoffee) => ClosurePlan,
      planShip: (redating: RedatingParcels) => ShipMove[],
    ): Promise<DayUpdateResult> {
      return db.transaction(async (tx) => {
        await tx.execute(sql`select pg_advisory_xact_lock(hashtext('restday:roast-calendar'))`);
        const [existing] = await overridesBetween(tx, date, date);
        const override: OverrideRow = {
          date,
          open: update.open,
          // Left out keeps the day's shipping as it was.
          shipOpen: update.shipOpen === undefined ? (existing?.shipOpen ?? null) : update.shipOpen,
          capacityGrams: update.capacityGrams ?? null,
          note: update.note ?? existing?.note ?? '',
        };
        const { settings } = await loadShopSettings(tx);
        if (isWeeklyDefault(override, settings)) {
          await tx.delete(roastDays).where(eq(roastDays.date, date));
        } else {
          await tx
            .insert(roastDays)
            .values(override)
            .onConflictDoUpdate({
              target: roastDays.date,
              set: { open: override.open, shipOpen: override.shipOpen, capacityGrams: override.capacityGrams, note: override.note },
            });
        }

        // A change of the day's shipping re-dates the parcels that could ship on it.
        let shipMoves: ShipMove[] = [];
        if ((existing?.shipOpen ?? null) !== override.shipOpen) {
          const parcels = await parcelsAround(tx, date);
          if (parcels.length > 0) {
            const ahead = await context(tx, addDays(date, -SEARCH_HORIZON_DAYS), addDays(date, SEARCH_HORIZON_DAYS), true);
            shipMoves = planShip({ date, parcels, context: ahead });
            for (const move of shipMoves) {
              if (move.orderId) await tx.update(orders).set({ shipDate: move.shipDate }).where(eq(orders.id, move.orderId));
              if (move.deliveryId) await tx.update(deliveries).set({ shipDate: move.shipDate }).where(eq(deliveries.id, move.deliveryId));
            }
          }
        }

        const unchanged = async () => ({
          override,
          context: await context(tx, date, date, true),
          plan: { orders: [], deliveries: [], emails: [] },
          shipMoves,
        });
        if (override.open) return unchanged();

        const movingOrders = await ordersOn(tx, date);
        const carried = new Set(movingOrders.flatMap((order) => (order.deliveryId ? [order.deliveryId] : [])));
        const movingDeliveries = await deliveriesOn(tx, date, carried);
        if (movingOrders.length === 0 && movingDeliveries.length === 0) return unchanged();

        // What the days after the closed one already hold, as far ahead as a move may go.
        const ahead = await context(tx, addDays(date, 1), addDays(date, SEARCH_HORIZON_DAYS), true);
        const moves = plan({ closedDate: date, orders: movingOrders, deliveries: movingDeliveries, context: ahead });
        for (const move of moves.orders) {
          await tx.update(orders).set(move.dates).where(eq(orders.id, move.id));
          if (move.deliveryId) {
            await tx
              .update(deliveries)
              .set(move.dates)
              .where(and(eq(deliveries.id, move.deliveryId), eq(deliveries.roastDate, date)));
          }
        }
        for (const move of moves.deliveries) await tx.update(deliveries).set(move.dates).where(eq(deliveries.id, move.id));
        for (const email of moves.emails) await queueEmail(tx, { template: 'roast-day-moved', ...email });
        return { override, context: await context(tx, date, date, true), plan: moves, shipMoves };
      });
    },
  };
}

export type CalendarRepo = ReturnType<typeof createCalendarRepo>;
