import { and, asc, eq, gte, sql } from 'drizzle-orm';
import type { DeliveryChoice, PlannedDelivery } from '@shared/domain/delivery-plan';
import type { RoastDates } from '@shared/domain/roast-schedule';
import type { IsoDate } from '@shared/domain/shop-time';
import type { DeliveryStatus } from '@shared/domain/vocabulary';
import type { DbOrTx } from '../../db/client';
import { deliveries, subscriptions } from '../../db/schema/index';
import { dayColumns } from './subscription-records.repo';

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
    .where(
      and(
        eq(deliveries.subscriptionId, subscriptionId),
        sql`${deliveries.status} <> 'skipped'`,
        eq(deliveries.chargeDeferred, true),
        gte(deliveries.roastDate, today),
      ),
    );
}

/** Skipped rows whose charge Stripe has not moved yet, by roast date. */
export async function skipsAwaitingStripe(db: DbOrTx, subscriptionId: string, today: IsoDate) {
  return db
    .select({ id: deliveries.id, nominalDate: deliveries.nominalDate, roastDate: deliveries.roastDate })
    .from(deliveries)
    .where(
      and(
        eq(deliveries.subscriptionId, subscriptionId),
        eq(deliveries.status, 'skipped'),
        eq(deliveries.chargeDeferred, false),
        gte(deliveries.roastDate, today),
      ),
    )
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
