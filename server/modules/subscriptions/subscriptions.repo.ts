import { and, asc, desc, eq, gte, inArray, isNull, sql } from 'drizzle-orm';
import type { DeliveryChoice } from '@shared/domain/delivery-plan';
import type { IsoDate } from '@shared/domain/shop-time';
import type { RoastedBagSize, RoastLevel, SubscriptionStatus } from '@shared/domain/vocabulary';
import type { Db, DbOrTx, Tx } from '../../db/client';
import type { AddressSnapshot } from '../../db/schema/common';
import { deliveries, lots, rotationPicks, subscriptions } from '../../db/schema/index';
import { subscriptionSelect, loadScheduleContext, keptDeliveries } from './subscription-records.repo';

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

    /** Cancels a subscription whose first payment never came and leaves it out of the customer's list; false when it had started. */
    async discardIncomplete(subscriptionId: string, at: Date) {
      const discarded = await db
        .update(subscriptions)
        .set({ status: 'cancelled', cancelledAt: at, discardedAt: at })
        .where(and(eq(subscriptions.id, subscriptionId), eq(subscriptions.status, 'incomplete')))
        .returning({ id: subscriptions.id });
      return discarded.length > 0;
    },

    /** The customer's own subscription; someone else's reads as missing. */
    async findOwn(subscriptionId: string, userId: string) {
      const [row] = await subscriptionSelect(db).where(and(eq(subscriptions.id, subscriptionId), eq(subscriptions.userId, userId)));
      return row;
    },

    /** A customer's subscriptions, less checkouts they discarded. */
    async listOwn(userId: string) {
      return subscriptionSelect(db)
        .where(and(eq(subscriptions.userId, userId), isNull(subscriptions.discardedAt)))
        .orderBy(desc(subscriptions.createdAt), asc(subscriptions.id));
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
  pausedAt?: Date;
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
