import { and, asc, desc, eq, gte, inArray, sql } from 'drizzle-orm';
import type { DeliveryChoice, KeptDelivery, PlannedDelivery } from '@shared/domain/delivery-plan';
import type { RoastCalendar, RoastDates } from '@shared/domain/roast-schedule';
import { addDays, localDateOf, type IsoDate } from '@shared/domain/shop-time';
import { roastersRotationName, type DeliveryStatus, type RoastedBagSize, type RoastLevel, type SubscriptionStatus } from '@shared/domain/vocabulary';
import type { Db, DbOrTx, Tx } from '../../db/client';
import type { AddressSnapshot } from '../../db/schema/common';
import { deliveries, lots, orderItems, orders, rotationPicks, subscriptions, users } from '../../db/schema/index';
import { loadCalendarOverrides, loadShopSettings } from '../settings/settings.repo';

/** A subscription with what Deliveries and the e-mails need around it. */
function subscriptionSelect(db: DbOrTx) {
  return db
    .select({
      id: subscriptions.id,
      userId: subscriptions.userId,
      status: subscriptions.status,
      lotId: subscriptions.lotId,
      lotCode: lots.code,
      coffee: sql<string>`coalesce(${lots.name}, ${roastersRotationName})`,
      roastLevel: subscriptions.roastLevel,
      bagSize: subscriptions.bagSize,
      bagsPerDelivery: subscriptions.bagsPerDelivery,
      grind: subscriptions.grind,
      brewMethod: subscriptions.brewMethod,
      cadenceWeeks: subscriptions.cadenceWeeks,
      pausedUntil: subscriptions.pausedUntil,
      cancelAtPeriodEnd: subscriptions.cancelAtPeriodEnd,
      priceCents: subscriptions.priceCents,
      currency: subscriptions.currency,
      shippingAddress: subscriptions.shippingAddress,
      anchorDate: subscriptions.anchorDate,
      currentPeriodEnd: subscriptions.currentPeriodEnd,
      stripeSubscriptionId: subscriptions.stripeSubscriptionId,
      changeVersion: subscriptions.changeVersion,
      stripeSyncedVersion: subscriptions.stripeSyncedVersion,
      createdAt: subscriptions.createdAt,
      customerName: users.name,
      customerEmail: users.email,
    })
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .leftJoin(lots, eq(lots.id, subscriptions.lotId));
}

export type SubscriptionRecord = NonNullable<Awaited<ReturnType<ReturnType<typeof subscriptionSelect>['execute']>>[number]>;

type DeliveryDays = Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>;
/** Only the four day columns, whatever else the dates object carries. */
const dayColumns = ({ roastDate, shipDate, readyFrom, bestBefore }: DeliveryDays): DeliveryDays => ({ roastDate, shipDate, readyFrom, bestBefore });

/** Subscriptions sell roasted sizes only (a CHECK constraint keeps it so). */
const roastedSize = (size: string) => size as RoastedBagSize;

export function choiceOf(subscription: Pick<SubscriptionRecord, 'roastLevel' | 'bagSize' | 'bagsPerDelivery' | 'grind' | 'brewMethod'>): DeliveryChoice {
  return {
    roastLevel: subscription.roastLevel,
    bagSize: roastedSize(subscription.bagSize),
    bagsPerDelivery: subscription.bagsPerDelivery,
    grind: subscription.grind,
    brewMethod: subscription.brewMethod,
  };
}

/** The shop's settings, today in the shop, and the calendar overrides around it (closures move deliveries; searches look 120 days on). */
export async function loadScheduleContext(db: DbOrTx, now: Date) {
  const { settings } = await loadShopSettings(db);
  const today = localDateOf(now, settings.timeZone);
  const calendar: RoastCalendar = { overrides: await loadCalendarOverrides(db, addDays(today, -180)) };
  return { settings, calendar, today };
}

/** The columns of a kept delivery row the delivery plan reads. */
export const keptDeliveryColumns = {
  id: deliveries.id,
  subscriptionId: deliveries.subscriptionId,
  nominalDate: deliveries.nominalDate,
  roastDate: deliveries.roastDate,
  shipDate: deliveries.shipDate,
  readyFrom: deliveries.readyFrom,
  bestBefore: deliveries.bestBefore,
  status: deliveries.status,
  orderId: deliveries.orderId,
  roastLevel: deliveries.roastLevel,
  bagSize: deliveries.bagSize,
  bagsPerDelivery: deliveries.bagsPerDelivery,
  grind: deliveries.grind,
  brewMethod: deliveries.brewMethod,
};

type KeptDeliveryRow = Pick<typeof deliveries.$inferSelect, Exclude<keyof typeof keptDeliveryColumns, 'subscriptionId'>>;

/** A kept row as the delivery plan reads it: what it brings only once frozen (all five columns set). */
export function keptDeliveryOf(row: KeptDeliveryRow): KeptDelivery {
  return {
    id: row.id,
    nominalDate: row.nominalDate ?? row.roastDate,
    roastDate: row.roastDate,
    shipDate: row.shipDate,
    readyFrom: row.readyFrom,
    bestBefore: row.bestBefore,
    status: row.status,
    orderId: row.orderId,
    choice:
      row.roastLevel && row.bagSize && row.bagsPerDelivery && row.grind && row.brewMethod
        ? { roastLevel: row.roastLevel, bagSize: roastedSize(row.bagSize), bagsPerDelivery: row.bagsPerDelivery, grind: row.grind, brewMethod: row.brewMethod }
        : null,
  };
}

/** A subscription's kept delivery rows, as the delivery plan reads them. */
export async function keptDeliveries(db: DbOrTx, subscriptionId: string): Promise<KeptDelivery[]> {
  const rows = await db.select(keptDeliveryColumns).from(deliveries).where(eq(deliveries.subscriptionId, subscriptionId)).orderBy(asc(deliveries.roastDate));
  return rows.map(keptDeliveryOf);
}

export async function lockSubscription(db: DbOrTx, subscriptionId: string) {
  const [row] = await subscriptionSelect(db).where(eq(subscriptions.id, subscriptionId)).for('update', { of: subscriptions });
  return row;
}

export interface KeptChange {
  status: DeliveryStatus;
  dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>;
  /** Freeze what it brings; undefined leaves the row as it was (null: follows the subscription). */
  choice?: DeliveryChoice | null;
  orderId?: string | null;
  chargeDeferred?: boolean;
}

/**
 * Writes the row for one grid date (creating it when only the grid knew it) and returns its id.
 * Rows are unique per (subscription, grid date), so writing the same delivery twice keeps one row.
 */
export async function keepDelivery(db: DbOrTx, subscriptionId: string, delivery: Pick<PlannedDelivery, 'nominalDate' | 'keptId'>, change: KeptChange) {
  const values = {
    status: change.status,
    ...dayColumns(change.dates),
    ...(change.choice !== undefined
      ? {
          roastLevel: change.choice?.roastLevel ?? null,
          bagSize: change.choice?.bagSize ?? null,
          bagsPerDelivery: change.choice?.bagsPerDelivery ?? null,
          grind: change.choice?.grind ?? null,
          brewMethod: change.choice?.brewMethod ?? null,
        }
      : {}),
    ...(change.orderId !== undefined ? { orderId: change.orderId } : {}),
    ...(change.chargeDeferred !== undefined ? { chargeDeferred: change.chargeDeferred } : {}),
  };
  if (delivery.keptId) {
    await db.update(deliveries).set(values).where(eq(deliveries.id, delivery.keptId));
    return delivery.keptId;
  }
  const [row] = await db
    .insert(deliveries)
    .values({
      subscriptionId,
      nominalDate: delivery.nominalDate,
      sequence: sql`(select coalesce(max(${deliveries.sequence}), 0) + 1 from ${deliveries} where ${deliveries.subscriptionId} = ${subscriptionId})`,
      ...values,
    })
    .onConflictDoUpdate({ target: [deliveries.subscriptionId, deliveries.nominalDate], set: values })
    .returning({ id: deliveries.id });
  if (!row) throw new Error(`keeping delivery ${delivery.nominalDate} of ${subscriptionId} returned no row`);
  return row.id;
}

/** Removes a kept row whose only reason was the payment now held for a later delivery. */
export async function dropDelivery(db: DbOrTx, deliveryId: string) {
  await db.delete(deliveries).where(eq(deliveries.id, deliveryId));
}

/** Rows no longer skipped whose charge Stripe had already moved on: the sync moves it back. */
export async function unskipsAwaitingStripe(db: DbOrTx, subscriptionId: string, today: IsoDate) {
  return db
    .select({ id: deliveries.id })
    .from(deliveries)
    .where(and(eq(deliveries.subscriptionId, subscriptionId), sql`${deliveries.status} <> 'skipped'`, eq(deliveries.chargeDeferred, true), gte(deliveries.roastDate, today)));
}

/** Skipped rows whose charge Stripe has not moved yet, by roast date. */
export async function skipsAwaitingStripe(db: DbOrTx, subscriptionId: string, today: IsoDate) {
  return db
    .select({ id: deliveries.id, nominalDate: deliveries.nominalDate, roastDate: deliveries.roastDate })
    .from(deliveries)
    .where(and(eq(deliveries.subscriptionId, subscriptionId), eq(deliveries.status, 'skipped'), eq(deliveries.chargeDeferred, false), gte(deliveries.roastDate, today)))
    .orderBy(asc(deliveries.roastDate));
}

/** How many skips Stripe has moved a charge for, over the subscription's life. */
export async function deferredSkipCount(db: DbOrTx, subscriptionId: string) {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(deliveries)
    .where(and(eq(deliveries.subscriptionId, subscriptionId), eq(deliveries.chargeDeferred, true)));
  return row?.n ?? 0;
}

export function createSubscriptionsRepo(db: Db) {
  return {
    async lotForSubscription(code: string) {
      const [lot] = await db
        .select({ id: lots.id, code: lots.code, name: lots.name, allowedLevels: lots.allowedLevels, stockGrams: lots.stockGrams })
        .from(lots)
        .where(and(eq(lots.code, code), eq(lots.isListed, true)));
      return lot;
    },

    async createSubscription(values: {
      userId: string;
      lotId: string | null;
      roastLevel: RoastLevel;
      choice: DeliveryChoice;
      cadenceWeeks: number;
      shippingAddress: AddressSnapshot;
      priceCents: number;
      currency: string;
    }) {
      const [row] = await db
        .insert(subscriptions)
        .values({
          userId: values.userId,
          lotId: values.lotId,
          ...values.choice,
          cadenceWeeks: values.cadenceWeeks,
          shippingAddress: values.shippingAddress,
          priceCents: values.priceCents,
          currency: values.currency,
        })
        .returning({ id: subscriptions.id });
      if (!row) throw new Error('inserting a subscription returned no row');
      return row.id;
    },

    async lotLevels(lotId: string) {
      const [lot] = await db.select({ allowedLevels: lots.allowedLevels }).from(lots).where(eq(lots.id, lotId));
      return lot?.allowedLevels;
    },

    /** The Roaster's Rotation lots staff have picked for these roast days. */
    async rotationPicks(roastDates: readonly IsoDate[]) {
      const picks = new Map<IsoDate, { code: string; name: string }>();
      if (roastDates.length === 0) return picks;
      const rows = await db
        .select({ roastDate: rotationPicks.roastDate, code: lots.code, name: lots.name })
        .from(rotationPicks)
        .innerJoin(lots, eq(lots.id, rotationPicks.lotId))
        .where(inArray(rotationPicks.roastDate, [...roastDates]));
      for (const row of rows) picks.set(row.roastDate, { code: row.code, name: row.name });
      return picks;
    },

    async cancelIncomplete(subscriptionId: string, at: Date) {
      await db
        .update(subscriptions)
        .set({ status: 'cancelled', cancelledAt: at })
        .where(and(eq(subscriptions.id, subscriptionId), eq(subscriptions.status, 'incomplete')));
    },

    /** The customer's own subscription; someone else's reads as missing. */
    async findOwn(subscriptionId: string, userId: string) {
      const [row] = await subscriptionSelect(db).where(and(eq(subscriptions.id, subscriptionId), eq(subscriptions.userId, userId)));
      return row;
    },

    async listOwn(userId: string) {
      return subscriptionSelect(db).where(eq(subscriptions.userId, userId)).orderBy(desc(subscriptions.createdAt), asc(subscriptions.id));
    },

    keptDeliveries: (subscriptionId: string) => keptDeliveries(db, subscriptionId),
    scheduleContext: (now: Date) => loadScheduleContext(db, now),

    async findById(subscriptionId: string) {
      const [row] = await subscriptionSelect(db).where(eq(subscriptions.id, subscriptionId));
      return row;
    },

    /** Subscriptions whose Stripe side is behind (a change not pushed, or a skip whose charge is not moved yet). */
    async idsAwaitingStripe(today: IsoDate, limit = 100) {
      const rows = await db
        .selectDistinct({ id: subscriptions.id })
        .from(subscriptions)
        .leftJoin(
          deliveries,
          and(
            eq(deliveries.subscriptionId, subscriptions.id),
            gte(deliveries.roastDate, today),
            // A skip whose charge is not moved yet, or an undone skip whose charge is not moved back.
            sql`(${deliveries.status} = 'skipped') <> ${deliveries.chargeDeferred}`,
          ),
        )
        .where(
          and(
            sql`${subscriptions.stripeSubscriptionId} is not null`,
            sql`${subscriptions.status} <> 'cancelled'`,
            sql`(${subscriptions.stripeSyncedVersion} < ${subscriptions.changeVersion} or ${deliveries.id} is not null)`,
          ),
        )
        .limit(limit);
      return rows.map((row) => row.id);
    },

    /** Runs `work` in one transaction (the e-mail outbox joins it through `tx`). */
    transaction<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
      return db.transaction(work);
    },
  };
}

export type SubscriptionsRepo = ReturnType<typeof createSubscriptionsRepo>;

export interface SubscriptionFieldsChange {
  roastLevel?: RoastLevel;
  bagSize?: RoastedBagSize;
  bagsPerDelivery?: number;
  grind?: DeliveryChoice['grind'];
  brewMethod?: DeliveryChoice['brewMethod'];
  cadenceWeeks?: number;
  shippingAddress?: AddressSnapshot;
  priceCents?: number;
  anchorDate?: IsoDate | null;
  pausedUntil?: IsoDate | null;
  cancelAtPeriodEnd?: boolean;
  status?: SubscriptionStatus;
}

/** Applies a self-service change and bumps the change version (the Stripe sync pushes that version). */
export async function changeSubscription(db: DbOrTx, subscriptionId: string, change: SubscriptionFieldsChange) {
  const [row] = await db
    .update(subscriptions)
    .set({ ...change, changeVersion: sql`${subscriptions.changeVersion} + 1` })
    .where(eq(subscriptions.id, subscriptionId))
    .returning({ changeVersion: subscriptions.changeVersion });
  return row?.changeVersion ?? 0;
}

/** Drops grid rows that only said "as the subscription is" (no order, not skipped or held), from a date on: a new cadence re-draws the grid. */
export async function dropUnpaidRowsFrom(db: DbOrTx, subscriptionId: string, nominalFrom: IsoDate) {
  await db
    .delete(deliveries)
    .where(
      and(
        eq(deliveries.subscriptionId, subscriptionId),
        gte(deliveries.nominalDate, nominalFrom),
        sql`${deliveries.orderId} is null`,
        sql`${deliveries.status} in ('scheduled', 'skipped')`,
      ),
    );
}

/** A paid delivery whose cutoff is ahead takes the new level, grind, brew method and address (its price does not change). */
export async function reshapePaidOrder(
  db: DbOrTx,
  orderId: string,
  change: { choice: DeliveryChoice; dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>; shippingAddress: AddressSnapshot },
) {
  await db
    .update(orderItems)
    .set({ roastLevel: change.choice.roastLevel, grind: change.choice.grind, brewMethod: change.choice.brewMethod })
    .where(eq(orderItems.orderId, orderId));
  await db
    .update(orders)
    .set({ ...dayColumns(change.dates), shippingAddress: change.shippingAddress })
    .where(and(eq(orders.id, orderId), sql`${orders.status} in ('paid', 'held')`));
}

/** Moves a paid order to another delivery (a skipped one's payment covers the next). */
export async function moveOrderToDelivery(db: DbOrTx, orderId: string, deliveryId: string, dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>) {
  await db.update(orders).set({ deliveryId, ...dayColumns(dates) }).where(eq(orders.id, orderId));
}

export async function markSynced(db: DbOrTx, subscriptionId: string, version: number, deferredSkipIds: readonly string[], restoredIds: readonly string[] = []) {
  await db
    .update(subscriptions)
    .set({ stripeSyncedVersion: sql`greatest(${subscriptions.stripeSyncedVersion}, ${version})` })
    .where(eq(subscriptions.id, subscriptionId));
  for (const id of deferredSkipIds) await db.update(deliveries).set({ chargeDeferred: true }).where(eq(deliveries.id, id));
  for (const id of restoredIds) await db.update(deliveries).set({ chargeDeferred: false }).where(eq(deliveries.id, id));
}

export async function setAnchorDate(db: DbOrTx, subscriptionId: string, anchorDate: IsoDate) {
  await db.update(subscriptions).set({ anchorDate }).where(eq(subscriptions.id, subscriptionId));
}

export async function findOrderIdByInvoice(db: DbOrTx, stripeInvoiceId: string) {
  const [row] = await db.select({ id: orders.id }).from(orders).where(eq(orders.stripeInvoiceId, stripeInvoiceId));
  return row?.id;
}

export interface NewDeliveryOrder {
  userId: string;
  subscriptionId: string;
  stripeInvoiceId: string;
  stripePaymentIntentId: string | null;
  currency: string;
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  totalCents: number;
  shippingAddress: AddressSnapshot;
  dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>;
  paidAt: Date;
  item: Omit<typeof orderItems.$inferInsert, 'orderId' | 'kind' | 'id'>;
}

/** A paid delivery's order (kind roasted) and its one line; undefined when the invoice already has its order. */
export async function createDeliveryOrder(db: DbOrTx, order: NewDeliveryOrder): Promise<string | undefined> {
  const [row] = await db
    .insert(orders)
    .values({
      userId: order.userId,
      kind: 'roasted',
      status: 'paid',
      subscriptionId: order.subscriptionId,
      subtotalCents: order.subtotalCents,
      discountCents: order.discountCents,
      shippingCents: order.shippingCents,
      totalCents: order.totalCents,
      currency: order.currency,
      shippingAddress: order.shippingAddress,
      ...dayColumns(order.dates),
      stripeInvoiceId: order.stripeInvoiceId,
      stripePaymentIntentId: order.stripePaymentIntentId,
      paidAt: order.paidAt,
    })
    .onConflictDoNothing({ target: orders.stripeInvoiceId })
    .returning({ id: orders.id });
  if (!row) return undefined;
  await db.insert(orderItems).values({ ...order.item, orderId: row.id, kind: 'roasted' });
  return row.id;
}

export async function linkOrderToDelivery(db: DbOrTx, orderId: string, deliveryId: string) {
  await db.update(orders).set({ deliveryId }).where(eq(orders.id, orderId));
}
