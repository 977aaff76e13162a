import { asc, eq, sql } from 'drizzle-orm';
import type { DeliveryChoice, KeptDelivery } from '@shared/domain/delivery-plan';
import type { RoastCalendar, RoastDates } from '@shared/domain/roast-schedule';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import { roastersRotationName, type RoastedBagSize } from '@shared/domain/vocabulary';
import type { DbOrTx } from '../../db/client';
import { deliveries, lots, subscriptions, users } from '../../db/schema/index';
import { loadCalendarOverrides, loadShopSettings } from '../settings';

/** A subscription with what Deliveries and the e-mails need around it. */
export function subscriptionSelect(db: DbOrTx) {
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
export const dayColumns = ({ roastDate, shipDate, readyFrom, bestBefore }: DeliveryDays): DeliveryDays => ({ roastDate, shipDate, readyFrom, bestBefore });

/** Subscriptions sell roasted sizes only (a CHECK constraint keeps it so). */
export const roastedSize = (size: string) => size as RoastedBagSize;

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
