import { and, eq, gt, isNull, lt } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { lots, subscriptions, users } from '../../db/schema/index';
import { queueEmail, type QueuedEmail } from '../outbox';
import { loadShopSettings } from '../settings';

export function createRenewalRemindersRepo(db: Db) {
  return {
    async shopSettings() {
      return (await loadShopSettings(db)).settings;
    },

    /**
     * Active subscriptions whose next charge (the end of the paid period) falls after `after` and
     * before `before`; never a cancelled one or one set to end with its period.
     */
    async renewingBetween(after: Date, before: Date) {
      return db
        .select({
          id: subscriptions.id,
          email: users.email,
          name: users.name,
          lotName: lots.name,
          priceCents: subscriptions.priceCents,
          currency: subscriptions.currency,
          pausedUntil: subscriptions.pausedUntil,
          currentPeriodEnd: subscriptions.currentPeriodEnd,
        })
        .from(subscriptions)
        .innerJoin(users, eq(users.id, subscriptions.userId))
        .leftJoin(lots, eq(lots.id, subscriptions.lotId))
        .where(
          and(
            eq(subscriptions.status, 'active'),
            eq(subscriptions.cancelAtPeriodEnd, false),
            isNull(subscriptions.cancelledAt),
            gt(subscriptions.currentPeriodEnd, after),
            lt(subscriptions.currentPeriodEnd, before),
          ),
        );
    },

    async queueReminder(message: QueuedEmail<'renewal-reminder'>) {
      await db.transaction((tx) => queueEmail(tx, message));
    },
  };
}

export type RenewalRemindersRepo = ReturnType<typeof createRenewalRemindersRepo>;
